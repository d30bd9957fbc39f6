/**
 * One HTTP call to a bench's own server over loopback, timed from request to last byte, with
 * gzip asked for (as a browser asks), and what the benches read of the answer; shared by
 * sync.bench.ts and scale.bench.ts.
 */
import { request as httpRequest, type IncomingHttpHeaders } from 'node:http';
import { gunzipSync } from 'node:zlib';

export interface Answer {
  status: number;
  headers: IncomingHttpHeaders;
  /** Bytes on the wire (compressed when the server compressed). */
  wireBytes: number;
  body: string;
  ms: number;
}

export function call(port: number, method: 'GET' | 'POST', path: string, headers: Record<string, string>, payload?: string): Promise<Answer> {
  return new Promise((resolve, reject) => {
    const start = process.hrtime.bigint();
    const req = httpRequest({ host: '127.0.0.1', port, method, path, headers: { 'accept-encoding': 'gzip', ...headers } }, (res) => {
      const chunks: Buffer[] = [];
      res.on('data', (chunk: Buffer) => chunks.push(chunk));
      res.on('end', () => {
        const ms = Number(process.hrtime.bigint() - start) / 1e6;
        const raw = Buffer.concat(chunks);
        const body = res.headers['content-encoding'] === 'gzip' ? gunzipSync(raw).toString('utf8') : raw.toString('utf8');
        resolve({ status: res.statusCode ?? 0, headers: res.headers, wireBytes: raw.length, body, ms });
      });
      res.on('error', reject);
    });
    req.on('error', reject);
    if (payload) req.end(payload);
    else req.end();
  });
}

/** Keeps the cookies `answer` sets in `jar` (name → value). */
export function cookiesOf(answer: Answer, jar: Map<string, string>): void {
  for (const line of answer.headers['set-cookie'] ?? []) {
    const [pair] = line.split(';');
    const eq = pair!.indexOf('=');
    jar.set(pair!.slice(0, eq), pair!.slice(eq + 1));
  }
}

export const median = (values: number[]): number => [...values].sort((a, b) => a - b)[Math.floor(values.length / 2)]!;
