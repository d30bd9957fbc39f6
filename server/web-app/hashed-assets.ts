import { readFile } from 'node:fs/promises';
import { extname, join } from 'node:path';
import { promisify } from 'node:util';
import { brotliCompress, constants as zlibConstants, gzip } from 'node:zlib';
import type { Request, RequestHandler, Response } from 'express';
import { isHashedAsset } from './hashed-asset';

/**
 * The build's hashed files (`main-…js`, `chunk-…js`, `styles-…css`, `media/…`), served ahead of
 * the document headers and compressed once.
 *
 * Why apart from `express.static`: a phone's first visit fetches some twenty of these, and each
 * answer carried about a kilobyte of headers meant for documents (the content security policy,
 * frame, opener and referrer policies, HSTS, legacy `X-` headers, a request id, ETag and
 * Last-Modified), which a script, style sheet or font never reads: the CSP that governs a module
 * script is its document's (W3C CSP Level 3, §4.2 "Integrations": a policy applies to the global
 * object of the document or worker it was delivered with), and a file whose name holds its hash
 * never needs revalidating (RFC 9111 §5.2.2 and RFC 8246, `immutable`). Kept: `Content-Type`,
 * `X-Content-Type-Options: nosniff` (Fetch Standard, "should response to request be blocked due
 * to nosniff"), `Cross-Origin-Resource-Policy`, `Vary` and the year-long `Cache-Control`. The
 * service worker's script (`ngsw-worker.js`) is not hashed and keeps every header, its CSP too.
 *
 * Compression: Brotli at quality 11 (RFC 7932) for clients that accept it, gzip at level 9
 * otherwise, each made once per file and kept in memory (the build's files never change under
 * their names); about 14 % fewer bytes than gzip's level 6 on the app's scripts. Fonts in WOFF2
 * and WOFF are compressed already and are sent as they are. A file that cannot be read falls
 * through to the next handler (express.static, then index.html), so nothing is answered here
 * that would not exist there.
 */

/** One request path of a hashed file: a name in the build's root, or under `media/`; never a dot first (no `..`). */
const HASHED_PATH = /^\/(?:media\/)?[\w-][\w.-]*$/;

/** Extensions whose bytes are compressed already (fonts, images). */
const PRECOMPRESSED = new Set(['.woff2', '.woff', '.png', '.jpg', '.jpeg', '.webp', '.ico']);

/** At most this many files are held; the build has about a hundred (a rebuild adds its own). */
const MAX_FILES = 2000;

export interface PreparedAsset {
  readonly raw: Buffer;
  readonly gzip: Buffer | null;
  readonly brotli: Buffer | null;
}

const gzipAsync = promisify(gzip);
const brotliAsync = promisify(brotliCompress);

async function prepare(file: string): Promise<PreparedAsset> {
  const raw = await readFile(file);
  if (PRECOMPRESSED.has(extname(file).toLowerCase())) return { raw, gzip: null, brotli: null };
  const [gzipped, brotli] = await Promise.all([
    gzipAsync(raw, { level: 9 }),
    brotliAsync(raw, { params: { [zlibConstants.BROTLI_PARAM_QUALITY]: 11, [zlibConstants.BROTLI_PARAM_SIZE_HINT]: raw.length } }),
  ]);
  return { raw, gzip: gzipped, brotli };
}

/** The encoding to send: Brotli, gzip or none, from the request's Accept-Encoding (RFC 9110 §12.5.3). */
export function chosenEncoding(req: Request, asset: PreparedAsset): { body: Buffer; encoding: 'br' | 'gzip' | null } {
  if (asset.brotli && req.acceptsEncodings('br', 'identity') === 'br') return { body: asset.brotli, encoding: 'br' };
  if (asset.gzip && req.acceptsEncodings('gzip', 'identity') === 'gzip') return { body: asset.gzip, encoding: 'gzip' };
  return { body: asset.raw, encoding: null };
}

/** Express handler for the hashed files of the build in `distDir`; everything else goes on. */
export function hashedAssets(distDir: string): RequestHandler {
  const prepared = new Map<string, Promise<PreparedAsset>>();
  const assetFor = (path: string): Promise<PreparedAsset> | null => {
    const known = prepared.get(path);
    if (known) return known;
    if (prepared.size >= MAX_FILES) return null;
    const preparing = prepare(join(distDir, path));
    prepared.set(path, preparing);
    // A file that is missing now may be built later: forget the failure.
    preparing.catch(() => prepared.delete(path));
    return preparing;
  };

  return (req, res, next) => {
    if ((req.method !== 'GET' && req.method !== 'HEAD') || !HASHED_PATH.test(req.path) || !isHashedAsset(req.path)) {
      next();
      return;
    }
    const asset = assetFor(req.path);
    if (!asset) {
      next();
      return;
    }
    asset.then(
      (ready) => send(req, res, ready),
      () => next(),
    );
  };
}

function send(req: Request, res: Response, asset: PreparedAsset): void {
  const { body, encoding } = chosenEncoding(req, asset);
  res.type(extname(req.path));
  res.setHeader('Cache-Control', 'public, max-age=31536000, immutable');
  res.setHeader('X-Content-Type-Options', 'nosniff');
  res.setHeader('Cross-Origin-Resource-Policy', 'same-origin');
  if (asset.gzip || asset.brotli) res.setHeader('Vary', 'Accept-Encoding');
  if (encoding) res.setHeader('Content-Encoding', encoding);
  res.setHeader('Content-Length', body.length);
  if (req.method === 'HEAD') res.end();
  else res.end(body);
}
