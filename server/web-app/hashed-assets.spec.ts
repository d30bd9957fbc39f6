import { mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { get, type IncomingHttpHeaders, type Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { brotliDecompressSync, gunzipSync } from 'node:zlib';
import express from 'express';
import request from 'supertest';
import { hashedAssets } from './hashed-assets';

/** A GET whose body comes back as sent, still compressed (supertest would decode it). */
function rawGet(server: Server, path: string, acceptEncoding: string): Promise<{ status: number; headers: IncomingHttpHeaders; body: Buffer }> {
  const { port } = server.address() as AddressInfo;
  return new Promise((resolve, reject) => {
    get({ host: '127.0.0.1', port, path, headers: { 'Accept-Encoding': acceptEncoding } }, (res) => {
      const parts: Buffer[] = [];
      res.on('data', (part: Buffer) => parts.push(part));
      res.on('end', () => resolve({ status: res.statusCode ?? 0, headers: res.headers, body: Buffer.concat(parts) }));
    }).on('error', reject);
  });
}

describe('hashedAssets', () => {
  let dir: string;
  let app: express.Express;
  let server: Server;
  const script = `export const figures = [${Array.from({ length: 400 }, (_, i) => i * 7).join(',')}];\n`;
  const font = Buffer.from([0x77, 0x4f, 0x46, 0x32, 1, 2, 3, 4]);

  beforeAll(async () => {
    dir = mkdtempSync(join(tmpdir(), 'speedwright-hashed-'));
    writeFileSync(join(dir, 'chunk-AbCd12_-.js'), script);
    writeFileSync(join(dir, 'ngsw-worker.js'), 'self.x = 1;');
    writeFileSync(join(dir, 'index.html'), '<!doctype html>');
    mkdirSync(join(dir, 'media'));
    writeFileSync(join(dir, 'media', 'roboto-latin-400-normal-ABCD1234.woff2'), font);
    app = express();
    app.use(hashedAssets(dir));
    // What the real app would do next (helmet, express.static, index.html): marked to be seen.
    app.use((_req, res) => res.status(299).send('passed on'));
    server = app.listen(0, '127.0.0.1');
    await new Promise((resolve) => server.once('listening', resolve));
  });

  afterAll(async () => {
    await new Promise((resolve) => server.close(resolve));
    rmSync(dir, { recursive: true, force: true });
  });

  it('sends a hashed script in Brotli with only the headers a script needs', async () => {
    const res = await rawGet(server, '/chunk-AbCd12_-.js', 'gzip, deflate, br');
    expect(res.status).toBe(200);
    expect(res.headers['content-encoding']).toBe('br');
    expect(brotliDecompressSync(res.body).toString()).toBe(script);
    expect(res.headers['content-type']).toMatch(/^text\/javascript/);
    expect(res.headers['cache-control']).toBe('public, max-age=31536000, immutable');
    expect(res.headers['x-content-type-options']).toBe('nosniff');
    expect(res.headers['vary']).toBe('Accept-Encoding');
    for (const header of ['content-security-policy', 'strict-transport-security', 'x-frame-options', 'etag', 'last-modified', 'x-request-id']) {
      expect(res.headers[header]).toBeUndefined();
    }
  });

  it('sends gzip to a client without Brotli, and the plain bytes to one without either', async () => {
    const gzipped = await rawGet(server, '/chunk-AbCd12_-.js', 'gzip');
    expect(gzipped.headers['content-encoding']).toBe('gzip');
    expect(gunzipSync(gzipped.body).toString()).toBe(script);
    const plain = await request(app).get('/chunk-AbCd12_-.js').set('Accept-Encoding', 'identity');
    expect(plain.headers['content-encoding']).toBeUndefined();
    expect(plain.text).toBe(script);
  });

  it('sends fonts as they are (WOFF2 is compressed already)', async () => {
    const res = await rawGet(server, '/media/roboto-latin-400-normal-ABCD1234.woff2', 'gzip, br');
    expect(res.status).toBe(200);
    expect(res.headers['content-encoding']).toBeUndefined();
    expect(res.headers['content-type']).toBe('font/woff2');
    expect(Buffer.compare(res.body, font)).toBe(0);
  });

  it('answers HEAD with the headers and no body', async () => {
    const res = await request(app).head('/chunk-AbCd12_-.js').set('Accept-Encoding', 'br');
    expect(res.status).toBe(200);
    expect(res.headers['content-encoding']).toBe('br');
    expect(Number(res.headers['content-length'])).toBeGreaterThan(0);
  });

  it('passes on everything else: unhashed files, missing files, other methods and paths out of the build', async () => {
    for (const path of ['/ngsw-worker.js', '/index.html', '/chunk-Missing1.js', '/media/..', '/../chunk-AbCd12_-.js', '/media/%2e%2e/x-ABCD1234.js', '/check/ABC']) {
      const res = await request(app).get(path);
      expect([path, res.status]).toEqual([path, 299]);
    }
    expect((await request(app).post('/chunk-AbCd12_-.js')).status).toBe(299);
  });
});
