/**
 * The files under a folder, for copying attachments into a backup and for checking a backup
 * folder against its manifest. Symbolic links are not followed (a link could lead out of the
 * folder or round in a circle); the walk is bounded in depth and in count.
 */
import { lstat, readdir, rm } from 'node:fs/promises';
import { join } from 'node:path';
import { DomainError } from '../errors/domain-error';

/** ATTACHMENTS_DIR is `<operator id>/<file>`; a backup folder adds one level. Far more than either needs. */
export const MAX_FOLDER_DEPTH = 8;
/** Far beyond any operator's source pages (20 a revision); a folder with more is not what we think it is. */
export const MAX_FOLDER_FILES = 10_000_000;

export interface FolderEntry {
  /** `/`-separated, relative to the folder walked. */
  path: string;
  sizeBytes: number;
}

/**
 * Every regular file under `root`, sorted by path.
 * @throws DomainError (refused) for a link, device or other non-file entry, or a folder deeper
 *   or fuller than the bounds; the sentence names `describe(path)`
 */
export async function filesUnder(root: string, describe: (path: string) => string = (path) => path): Promise<FolderEntry[]> {
  const found: FolderEntry[] = [];
  const visit = async (relative: string, depth: number): Promise<void> => {
    const entries = await readdir(relative ? join(root, relative) : root, { withFileTypes: true });
    for (const entry of entries) {
      const path = relative ? `${relative}/${entry.name}` : entry.name;
      if (entry.isDirectory()) {
        if (depth + 1 >= MAX_FOLDER_DEPTH) throw new DomainError('refused', 'folder_too_deep', `${describe(path)} lies deeper than ${MAX_FOLDER_DEPTH} folders; this is not a folder Speedwright wrote.`);
        await visit(path, depth + 1);
      } else if (entry.isFile()) {
        if (found.length >= MAX_FOLDER_FILES) throw new DomainError('refused', 'folder_too_full', `${describe(root)} holds more than ${MAX_FOLDER_FILES} files; this is not a folder Speedwright wrote.`);
        found.push({ path, sizeBytes: (await lstat(join(root, path))).size });
      } else {
        throw new DomainError('refused', 'not_a_file', `${describe(path)} is ${entry.isSymbolicLink() ? 'a symbolic link' : 'not a regular file'}; only regular files are backed up and restored.`);
      }
    }
  };
  await visit('', 0);
  return found.sort((a, b) => (a.path < b.path ? -1 : a.path > b.path ? 1 : 0));
}

/** Whether `path` is absent, or a folder with nothing in it. Anything else (a file, a non-empty folder) is false. */
export async function isAbsentOrEmptyFolder(path: string): Promise<boolean> {
  const found = await lstat(path).catch((error: NodeJS.ErrnoException) => {
    if (error.code === 'ENOENT') return undefined;
    throw error;
  });
  if (!found) return true;
  return found.isDirectory() && (await readdir(path)).length === 0;
}

/** Removes everything inside `path`, keeping the folder itself (one that someone made for us, with its owner and mode). */
export async function emptyFolder(path: string): Promise<void> {
  const entries = await readdir(path).catch(() => [] as string[]);
  for (const entry of entries) await rm(join(path, entry), { recursive: true, force: true });
}
