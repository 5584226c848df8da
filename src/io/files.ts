/**
 * Files for people: the one-line reason a file-system call failed, and reading a text file with
 * an error that names the file, what it was read as and why.
 */
import { readFileSync } from 'node:fs';
import { TilefluxError } from '../errors.js';

/** What a failed system call on a file means for the user, by Node error code. */
const FS_REASONS: Readonly<Record<string, string>> = {
  ENOENT: 'no such file or folder',
  EEXIST: 'something of that name already exists',
  ENOTDIR: 'a part of the path is a file, not a folder',
  EISDIR: 'it is a folder, not a file',
  ENAMETOOLONG: 'a name in the path is too long (most file systems allow 255 bytes)',
  EACCES: 'permission denied',
  EPERM: 'operation not permitted',
  EROFS: 'the file system is read-only',
  ENOSPC: 'no space left on the device',
  EDQUOT: 'the disk quota is used up',
  EFBIG: 'the file is larger than the file system or the file-size limit (ulimit -f) allows',
  EXDEV: 'the temporary folder and the target lie on different file systems',
  ENOTEMPTY: 'the folder is not empty',
  EMFILE: 'too many open files',
};

/** The one-line reason for a file-system error, or undefined when `err` is not one. */
export function fsErrorReason(err: unknown): string | undefined {
  const code = (err as NodeJS.ErrnoException | undefined)?.code;
  return typeof code === 'string' ? FS_REASONS[code] : undefined;
}

/**
 * A text file's content; a file that cannot be read is a user error naming what it was read as,
 * the file and why.
 * @example readTextFile('w.csv', 'weather file') // throws "cannot read weather file w.csv: no such file or folder"
 */
export function readTextFile(path: string, what: string): string {
  try {
    return readFileSync(path, 'utf8');
  } catch (err) {
    const code = (err as NodeJS.ErrnoException | undefined)?.code;
    throw new TilefluxError(
      `cannot read ${what} ${path}: ${fsErrorReason(err) ?? String(code ?? err)}`,
    );
  }
}
