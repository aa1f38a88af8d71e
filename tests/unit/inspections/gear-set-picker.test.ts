import { describe, expect, it } from 'vitest';
import { gearSetOptionLabel, pickableGearSets } from '../../../src/lib/inspections/gear-set-picker';

const sets = [
  { id: 'a', serial: 'GS-4101', status: 'in-service', ratioLabel: '4.10:1' },
  { id: 'b', serial: 'GS-4102', status: 'retired' },
  { id: 'c', serial: 'GS-3901', status: 'spare' },
  { id: 'd', serial: 'GS-4108', status: 'scrapped' },
  { id: 'e', serial: 'gs-4150', status: 'under-review' },
];

describe('the sheet’s gear set picker', () => {
  it('leaves out retired and scrapped sets, unless the sheet already names one', () => {
    expect(pickableGearSets(sets, '', null).map((s) => s.id)).toEqual(['a', 'c', 'e']);
    expect(pickableGearSets(sets, '', 'b').map((s) => s.id)).toEqual(['a', 'b', 'c', 'e']);
  });

  it('finds sets by any part of the serial, in either case', () => {
    expect(pickableGearSets(sets, ' 41 ', null).map((s) => s.id)).toEqual(['a', 'e']);
    expect(pickableGearSets(sets, 'GS-415', null).map((s) => s.id)).toEqual(['e']);
    expect(pickableGearSets(sets, '9999', 'c').map((s) => s.id)).toEqual(['c']);
  });

  it('names the state in words, never the stored value', () => {
    expect(gearSetOptionLabel(sets[0]!)).toBe('GS-4101 · 4.10:1');
    expect(gearSetOptionLabel(sets[4]!)).toBe('gs-4150 · under review');
  });
});
