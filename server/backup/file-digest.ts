/**
 * SHA-256 (FIPS 180-4) and size of files as they stream: a backup or restore holds one chunk of
 * a file in memory at a time (Node's stream buffer, 64 KiB), however large the file.
 */
import { createHash, type Hash } from 'node:crypto';
import { createReadStream, createWriteStream } from 'node:fs';
import { Transform, Writable, type TransformCallback } from 'node:stream';
import { pipeline } from 'node:stream/promises';

export interface FileDigest {
  sizeBytes: number;
  /** Lower-case hex. */
  sha256: string;
}

/**
 * A pass-through stream that counts and hashes what flows through it; `digest()` once it has
 * ended. Put it between any source and sink to learn what was written.
 */
export class DigestTap extends Transform {
  private readonly hash: Hash = createHash('sha256');
  private bytes = 0;

  override _transform(chunk: Buffer, _encoding: BufferEncoding, done: TransformCallback): void {
    this.hash.update(chunk);
    this.bytes += chunk.length;
    done(null, chunk);
  }

  digest(): FileDigest {
    return { sizeBytes: this.bytes, sha256: this.hash.digest('hex') };
  }
}

/** Size and SHA-256 of the file at `path`. */
export async function digestOfFile(path: string): Promise<FileDigest> {
  const tap = new DigestTap();
  // Only the tap's count and hash are wanted; the bytes go nowhere.
  const nowhere = new Writable({ write: (_chunk, _encoding, done) => done() });
  await pipeline(createReadStream(path), tap, nowhere);
  return tap.digest();
}

/**
 * Copies `from` to `to` (which must not exist yet), with file mode `mode`, and gives the size and
 * SHA-256 of the bytes written.
 */
export async function copyFileWithDigest(from: string, to: string, mode: number): Promise<FileDigest> {
  const tap = new DigestTap();
  await pipeline(createReadStream(from), tap, createWriteStream(to, { flags: 'wx', mode }));
  return tap.digest();
}
