// source: OWASP, "CSV Injection" (text cells starting with = + - @ tab CR get a leading apostrophe);
// RFC 4180 §2 (quoting of quotes, commas and line breaks).
import { describe, expect, it } from 'vitest';
import { csvCell } from '../../src/report/csvCell.js';
import { toCsv } from '../../src/report/csvTables.js';
import { sweepCsv } from '../../src/studies/sweepOutput.js';
import type { SweepTable } from '../../src/studies/sweepTable.js';

describe('csvCell', () => {
  it('neutralises text a spreadsheet would run as a formula', () => {
    expect(csvCell('=1+2')).toBe("'=1+2");
    expect(csvCell('+cmd')).toBe("'+cmd");
    expect(csvCell('-2+3')).toBe("'-2+3");
    expect(csvCell('@SUM(A1)')).toBe("'@SUM(A1)");
    expect(csvCell('\t=1')).toBe("'\t=1");
    expect(csvCell('\r=1')).toBe('"\'\r=1"');
    expect(csvCell('=HYPERLINK("http://x","y")')).toBe('"\'=HYPERLINK(""http://x"",""y"")"');
  });

  it('leaves numbers, numeric text and ordinary text unchanged', () => {
    expect(csvCell(-1.5)).toBe('-1.5');
    expect(csvCell(1e-7)).toBe('1e-7');
    expect(csvCell(0)).toBe('0');
    expect(csvCell(Infinity)).toBe('inf');
    expect(csvCell(-Infinity)).toBe('-inf');
    expect(csvCell(NaN)).toBe('');
    expect(csvCell(null)).toBe('');
    expect(csvCell(undefined)).toBe('');
    for (const t of ['-2.5', '+3', '-1e-3', '-Infinity', '-inf', '5.6 m', 'loads.dead', 'a-b']) expect(csvCell(t)).toBe(t);
    expect(csvCell('a,"b"')).toBe('"a,""b"""');
    expect(csvCell(true)).toBe('true');
  });

  it('is what the report tables and sweep.csv use', () => {
    expect(toCsv(['variable', 'value'], [['=cmd', -0.9], ['@x', 2]])).toBe("variable,value\n'=cmd,-0.9\n'@x,2\n");
    const records = [
      { case: 0, seed: 1, values: { 'loads.dead.mean': '-5 kN' }, result: { beta_form: -0.9 } },
      { case: 1, seed: 2, values: { 'loads.dead.mean': -3 }, result: { beta_form: 'Infinity' }, error: '=1+1 failed' },
    ];
    const table: SweepTable = {
      fingerprint: 'f',
      varied: ['loads.dead.mean'],
      cases: 2,
      columns: ['beta_form'],
      finished: 2,
      failed: 1,
      hasErrors: true,
      missingCount: 0,
      *rows() {
        yield* records;
      },
      *missing() {},
    };
    expect(sweepCsv(table)).toBe("case,loads.dead.mean,beta_form,error\n0,'-5 kN,-0.9,\n1,-3,Infinity,'=1+1 failed\n");
  });
});
