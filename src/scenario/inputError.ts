import { boundEchoes } from './shortenEcho.js';

/**
 * An error in what the user gave us: a scenario field, a command-line option.
 * The CLI prints `field: message` (with the line when known) and exits 2. Field and message
 * are bounded here, once, so no message can repeat a huge value back (shortenEcho.ts).
 */
export class InputError extends Error {
  readonly field: string;
  readonly line?: number;

  constructor(field: string, message: string, line?: number) {
    super(boundEchoes(message));
    this.name = 'InputError';
    this.field = boundEchoes(field);
    this.line = line;
  }

  /** One line for a person: `column.material.E (line 7): expected a pressure, got 4 m`. */
  describe(): string {
    const where = this.line !== undefined ? ` (line ${this.line})` : '';
    return `${this.field}${where}: ${this.message}`;
  }
}
