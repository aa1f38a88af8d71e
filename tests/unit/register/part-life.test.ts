import { describe, expect, it } from 'vitest';
import { lifeStateOf, lifeToText, runsLeftToText } from '../../../src/lib/register/part-life';
import { listsToPlaceLookup, locationToText } from '../../../src/lib/register/place';

describe('a part against its life limit', () => {
  it('says runs used, the limit and what is left in one line', () => {
    expect(lifeToText(38, 50)).toBe('38 of 50 runs — 12 left');
    expect(lifeToText(50, 50)).toBe('50 of 50 runs — at the limit');
    expect(lifeToText(53, 50)).toBe('53 of 50 runs — 3 over the limit');
    expect(lifeToText(1, null)).toBe('1 run — no life limit set');
  });

  it('flags a limit that falls inside the service interval as due soon', () => {
    expect(lifeStateOf(null, 8)).toBe('no-limit');
    expect(lifeStateOf(9, 8)).toBe('ok');
    expect(lifeStateOf(8, 8)).toBe('due');
    expect(lifeStateOf(0, 8)).toBe('at-limit');
    expect(lifeStateOf(-1, 8)).toBe('over');
  });

  it('writes runs left as a table cell', () => {
    expect(runsLeftToText(null)).toBe('—');
    expect(runsLeftToText(12)).toBe('12');
    expect(runsLeftToText(-3)).toBe('3 over');
  });
});

describe('where a part is', () => {
  const lookup = listsToPlaceLookup(
    [
      { id: 'a1', serial: 'RE-01', name: 'Ember rear end', carId: 'c1' },
      { id: 'a3', serial: 'RE-03', name: 'Spare rear end', carId: null },
    ],
    [{ id: 'c1', name: '714 Ember' }],
  );

  it('names the car the assembly sits in, or the shelf', () => {
    expect(
      locationToText({ targetType: 'assembly', targetId: 'a1', label: 'assembly RE-01 (Ember rear end)' }, lookup),
    ).toBe('RE-01 Ember rear end · in 714 Ember');
    expect(locationToText({ targetType: 'assembly', targetId: 'a3', label: 'x' }, lookup)).toBe(
      'RE-03 Spare rear end · on the shelf',
    );
    expect(locationToText({ targetType: 'car', targetId: 'c1', label: 'car 714 Ember' }, lookup)).toBe(
      'In 714 Ember (no assembly)',
    );
    expect(locationToText(null, lookup)).toBe('Not installed');
  });

  it('falls back to the server label for a place it does not know', () => {
    expect(locationToText({ targetType: 'assembly', targetId: 'new', label: 'assembly RE-09 (New)' }, lookup)).toBe(
      'assembly RE-09 (New)',
    );
  });
});
