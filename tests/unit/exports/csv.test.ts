import Papa from 'papaparse';
import { describe, expect, it } from 'vitest';
import { toCsv } from '../../../src/lib/exports/csv';

const LEADING = ['=', '+', '-', '@', '\t', '\r'];

describe('toCsv', () => {
  it.each(LEADING)('puts a quote before a text cell that starts with %j', (lead) => {
    const text = `${lead}cmd|' /C calc'!A0`;
    const csv = toCsv({ fields: ['reason'], data: [[text]] });
    const cells = Papa.parse<string[]>(csv).data;
    expect(cells[1]?.[0]).toBe(`'${text}`);
  });

  it('escapes a formula whose cell goes on past a line break', () => {
    const csv = toCsv({ fields: ['notes'], data: [['=1+1\nsecond line']] });
    expect(Papa.parse<string[]>(csv).data[1]?.[0]).toBe("'=1+1\nsecond line");
  });

  it('keeps negative numbers as numbers', () => {
    const csv = toCsv([{ change_mm: -0.0125, runs: -3, text: 'ok' }]);
    expect(csv).toBe('change_mm,runs,text\n-0.0125,-3,ok');
  });

  it('leaves ordinary text alone', () => {
    expect(toCsv({ fields: ['reason'], data: [['pitting on the drive side']] })).toBe(
      'reason\npitting on the drive side',
    );
  });
});
