// common practice: an error message quotes a bad value, never a megabyte of it.
import { describe, expect, it } from 'vitest';
import { ECHO_LIMIT, MESSAGE_LIMIT, boundEchoes, boundLines, shortenEcho } from '../../src/scenario/shortenEcho.js';
import { InputError } from '../../src/scenario/inputError.js';
import { loadScenario } from '../../src/scenario/loadScenario.js';
import { starterScenario } from '../../src/scenario/starterScenario.js';

describe('shortenEcho', () => {
  it('cuts a long value and says how long it was', () => {
    expect(shortenEcho('short')).toBe('short');
    expect(shortenEcho('a'.repeat(100_000))).toBe(`${'a'.repeat(ECHO_LIMIT)}… (100000 characters)`);
    const emoji = `${'a'.repeat(ECHO_LIMIT - 1)}😀${'b'.repeat(50)}`;
    expect(shortenEcho(emoji)).toBe(`${'a'.repeat(ECHO_LIMIT - 1)}… (${emoji.length} characters)`); // no half surrogate pair
  });

  it('bounds every long word of a message and the whole message', () => {
    const message = `expected a length, got '5.6 ${'a'.repeat(100_000)}' (e.g. 4.2 m)`;
    const bounded = boundEchoes(message);
    expect(bounded.length).toBeLessThan(200);
    expect(bounded).toMatch(/^expected a length, got '5\.6 a+… \(100001 characters\) \(e\.g\. 4\.2 m\)$/);
    const spaced = boundEchoes(`got ${'ab '.repeat(50_000)}`);
    expect(spaced.length).toBeLessThan(MESSAGE_LIMIT + 60);
    expect(spaced).toMatch(/… \(message of 150004 characters shortened\)$/);
    expect(boundLines(`usage\n${'x'.repeat(500)}\nend`)).toBe(`usage\n${'x'.repeat(ECHO_LIMIT)}… (500 characters)\nend`);
  });

  it('is applied by InputError to its field and message', () => {
    const e = new InputError(`loads.${'k'.repeat(10_000)}`, `got ${'v'.repeat(10_000)}`);
    expect(e.describe().length).toBeLessThan(250);
    expect(e.field).toMatch(/… \(10006 characters\)$/);
  });

  it('keeps a scenario error short when the scenario holds a huge value', () => {
    const text = starterScenario('braced').replace(/^title: .*$/m, `title: ${'t'.repeat(10)}`).replace(/^( {2}length: ).*$/m, `$14.2 ${'a'.repeat(100_000)}`);
    let message = '';
    try {
      loadScenario(text, 'big.yaml');
    } catch (e) {
      message = (e as InputError).describe();
    }
    expect(message).toMatch(/^column\.length/);
    expect(message.length).toBeLessThan(300);
  });
});
