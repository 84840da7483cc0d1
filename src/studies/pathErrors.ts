/**
 * File-system failures the user can fix (a file where a folder belongs, a read-only or
 * missing folder, no permission), turned into one InputError naming the option, so the
 * CLI exits 2 with a sentence instead of exiting 1 with an errno.
 */
import { InputError } from '../scenario/inputError.js';

const REASONS: Record<string, string> = {
  EACCES: 'permission denied',
  EPERM: 'operation not permitted',
  EROFS: 'the folder is on a read-only file system',
  ENOTDIR: 'a part of the path is a file, not a folder',
  EEXIST: 'a file is in the way',
  ENOENT: 'a folder on the path does not exist',
  EISDIR: 'it is a folder',
  ENOSPC: 'the disk is full',
  EDQUOT: 'the disk quota is used up',
};

/** An InputError for a user-fixable errno; anything else is returned unchanged. */
export function pathInputError(err: unknown, field: string, path: string): unknown {
  const code = (err as NodeJS.ErrnoException | null)?.code;
  if (code !== undefined && code in REASONS) return new InputError(field, `${path}: cannot write there (${REASONS[code]})`);
  return err;
}
