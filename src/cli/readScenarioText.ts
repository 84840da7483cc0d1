import { readFileSync } from 'node:fs';
import { InputError } from '../scenario/inputError.js';

/** Reads FILE, or standard input when FILE is `-`. Returns the text and the name used in messages. */
export function readScenarioText(file: string): { text: string; fileName: string } {
  if (file === '-') {
    try {
      return { text: readFileSync(0, 'utf8'), fileName: '-' };
    } catch {
      throw new InputError('FILE', 'could not read the scenario from standard input');
    }
  }
  if (!/\.(ya?ml|json)$/i.test(file)) {
    throw new InputError('FILE', `expected a .yaml, .yml or .json scenario file (or - for stdin), got ${file}`);
  }
  try {
    return { text: readFileSync(file, 'utf8'), fileName: file };
  } catch (err) {
    const code = (err as NodeJS.ErrnoException).code;
    const why = code === 'ENOENT' ? 'no such file' : code === 'EISDIR' ? 'is a folder, not a file' : 'cannot be read';
    throw new InputError('FILE', `${file}: ${why}`);
  }
}
