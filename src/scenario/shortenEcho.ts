/**
 * Bounds what a message repeats back of the user's input. A 100 000-character value must not
 * come back as a 100 000-character line: any run without spaces longer than ECHO_LIMIT is
 * cut to its start plus "… (N characters)", and a whole message to MESSAGE_LIMIT.
 */

export const ECHO_LIMIT = 80;
export const MESSAGE_LIMIT = 1000;

/** Cut `text` to `limit` characters (never inside a surrogate pair) and say how long it was. */
export function shortenEcho(text: string, limit = ECHO_LIMIT): string {
  if (text.length <= limit) return text;
  let end = limit;
  const last = text.charCodeAt(end - 1);
  if (last >= 0xd800 && last <= 0xdbff) end -= 1; // keep a surrogate pair whole
  return `${text.slice(0, end)}… (${text.length} characters)`;
}

const LONG_RUN = new RegExp(`\\S{${ECHO_LIMIT + 1},}`, 'g');

/** A message with every over-long word shortened, then the whole capped (a value with spaces). */
export function boundEchoes(message: string): string {
  const words = message.length > ECHO_LIMIT ? message.replace(LONG_RUN, (run) => shortenEcho(run)) : message;
  if (words.length <= MESSAGE_LIMIT) return words;
  return shortenEcho(words, MESSAGE_LIMIT).replace(/ \(\d+ characters\)$/, ` (message of ${words.length} characters shortened)`);
}

/** boundEchoes line by line, for text of several lines (commander's usage errors and help). */
export function boundLines(text: string): string {
  return text.length > ECHO_LIMIT ? text.split('\n').map(boundEchoes).join('\n') : text;
}
