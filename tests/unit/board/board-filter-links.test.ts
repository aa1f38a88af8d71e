import { describe, expect, it } from 'vitest';
import { readBoardFilter } from '../../../src/lib/board/board';
import { boardFilterHref, carChoices, statusChoices } from '../../../src/lib/board/board-filter-links';

const CARS = [
  { id: 'c1', name: '714 Ember' },
  { id: 'c2', name: '22 Blackwater' },
];
const LABELS = { 'in-service': 'In service', spare: 'Spare', 'under-review': 'Under review' };

describe('the board filter’s links', () => {
  it('leaves "all" out of the address, so the plain board stays /', () => {
    expect(boardFilterHref({ car: null, status: null })).toBe('/');
    expect(boardFilterHref({ car: 'c1', status: 'spare' }, { car: null })).toBe('/?status=spare');
    expect(boardFilterHref({ car: 'c1', status: 'spare' }, { status: null })).toBe('/?car=c1');
  });

  it('keeps the other row’s choice in every link', () => {
    const cars = carChoices({ car: null, status: 'spare' }, CARS);
    expect(cars.map((c) => [c.label, c.href])).toEqual([
      ['All cars', '/?status=spare'],
      ['714 Ember', '/?car=c1&status=spare'],
      ['22 Blackwater', '/?car=c2&status=spare'],
      ['Not in a car', '/?car=none&status=spare'],
    ]);
    const statuses = statusChoices({ car: 'none', status: null }, LABELS);
    expect(statuses.map((c) => [c.label, c.href])).toEqual([
      ['Any in use', '/?car=none'],
      ['In service', '/?car=none&status=in-service'],
      ['Spare', '/?car=none&status=spare'],
      ['Under review', '/?car=none&status=under-review'],
    ]);
  });

  it('marks exactly one choice per row as current', () => {
    const filter = { car: 'c2', status: null };
    expect(
      carChoices(filter, CARS)
        .filter((c) => c.current)
        .map((c) => c.label),
    ).toEqual(['22 Blackwater']);
    expect(
      statusChoices(filter, LABELS)
        .filter((c) => c.current)
        .map((c) => c.label),
    ).toEqual(['Any in use']);
  });

  it('links to addresses the board reads back as the same filter', () => {
    for (const choice of [
      ...carChoices({ car: null, status: 'under-review' }, CARS),
      ...statusChoices({ car: 'c1', status: null }, LABELS),
    ]) {
      const params = new URL(choice.href, 'http://board.test').searchParams;
      const read = readBoardFilter(
        params,
        CARS.map((c) => c.id),
      );
      expect(boardFilterHref(read)).toBe(choice.href);
    }
  });
});
