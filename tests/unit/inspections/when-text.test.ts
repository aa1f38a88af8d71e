import { describe, expect, it } from 'vitest';
import { dateToWhenText, parseWhenText } from '../../../src/lib/inspections/when-text';

// Local times throughout: the field is read in the device's own time zone.
const now = new Date(2026, 4, 3, 16, 42, 30);

describe('the date and time typed in one field', () => {
  it('reads a whole date and time, with a space or a T between them', () => {
    expect(parseWhenText('2026-05-03 14:30', now)).toEqual(new Date(2026, 4, 3, 14, 30));
    expect(parseWhenText('2026-5-3T07:05', now)).toEqual(new Date(2026, 4, 3, 7, 5));
  });

  it('reads a time alone as today, and a date alone as that day at noon', () => {
    expect(parseWhenText('9:15', now)).toEqual(new Date(2026, 4, 3, 9, 15));
    expect(parseWhenText('0915', now)).toEqual(new Date(2026, 4, 3, 9, 15));
    expect(parseWhenText('2026-04-30', now)).toEqual(new Date(2026, 3, 30, 12, 0));
  });

  it('reads "now" as this minute', () => {
    expect(parseWhenText(' Now ', now)).toEqual(new Date(2026, 4, 3, 16, 42));
  });

  it('refuses what is no date and time: a day the month lacks, hour 24, minute 60, words', () => {
    for (const text of ['2026-04-31 10:00', '2026-05-03 24:00', '10:60', 'yesterday', '', '3/5 14:30'])
      expect(parseWhenText(text, now), text).toBeNull();
  });

  it('writes a date back in the form it reads', () => {
    const date = new Date(2026, 0, 9, 8, 5);
    expect(dateToWhenText(date)).toBe('2026-01-09 08:05');
    expect(parseWhenText(dateToWhenText(date), now)).toEqual(date);
  });
});
