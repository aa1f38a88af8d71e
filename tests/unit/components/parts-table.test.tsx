// @vitest-environment jsdom
import { afterEach, describe, expect, it } from 'vitest';
import { cleanup, render, screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import PartsIsland from '../../../src/components/parts/PartsIsland';
import type { PartView } from '../../../src/lib/server/register/parts';
import { listsToPlaceLookup } from '../../../src/lib/register/place';

afterEach(cleanup);

const inRe01 = { targetType: 'assembly' as const, targetId: 'a1', label: 'assembly RE-01 (Ember rear end)', since: '2026-05-12T08:00:00.000Z' };

function part(fields: Partial<PartView> & Pick<PartView, 'id' | 'serial' | 'kind'>): PartView {
  const lifeLimitRuns = fields.lifeLimitRuns ?? null;
  const totalRuns = fields.totalRuns ?? 0;
  return {
    status: 'spare',
    lifeLimitRuns,
    runsSinceInstall: 0,
    totalRuns,
    runsLeft: lifeLimitRuns === null ? null : lifeLimitRuns - totalRuns,
    maker: null,
    model: null,
    material: null,
    notes: null,
    location: null,
    createdAt: '2026-03-01T08:00:00.000Z',
    ...fields,
  };
}

// A fixed register: runs left 6, −17, 50, 35, none, 29.
const PARTS: PartView[] = [
  part({ id: 'p1', serial: 'GS-4101', kind: 'gear-set', status: 'in-service', lifeLimitRuns: 50, totalRuns: 44, runsSinceInstall: 44, location: inRe01 }),
  part({ id: 'p2', serial: 'GS-4102', kind: 'gear-set', status: 'in-service', lifeLimitRuns: 50, totalRuns: 67, runsSinceInstall: 67 }),
  part({ id: 'p3', serial: 'GS-4104', kind: 'gear-set', status: 'spare', lifeLimitRuns: 50 }),
  part({ id: 'p4', serial: 'SP-11', kind: 'spindle', status: 'in-service', lifeLimitRuns: 100, totalRuns: 65, runsSinceInstall: 65, location: inRe01 }),
  part({ id: 'p5', serial: 'AX-11', kind: 'axle', status: 'in-service', totalRuns: 65, runsSinceInstall: 65, location: inRe01 }),
  part({ id: 'p6', serial: 'GS-4103', kind: 'gear-set', status: 'retired', lifeLimitRuns: 50, totalRuns: 21 }),
];
const LOOKUP = listsToPlaceLookup([{ id: 'a1', serial: 'RE-01', name: 'Ember rear end', carId: 'c1' }], [{ id: 'c1', name: '714 Ember' }]);

function renderTable(parts = PARTS, canAdd = false) {
  // Rendered just now: the seeded page is fresh, so the island makes no request.
  render(<PartsIsland initialPage={{ items: parts, nextCursor: null }} renderedAt={Date.now()} lookup={LOOKUP} dueWithin={8} canAdd={canAdd} />);
}
const serials = () => screen.queryAllByTestId('part-row').map((row) => row.dataset.serial);
const row = (serial: string) => screen.getAllByTestId('part-row').find((r) => r.dataset.serial === serial)!;

describe('the parts table', () => {
  it('shows each part with its status in words, where it is and its runs left', () => {
    renderTable();
    expect(serials()).toEqual(['GS-4101', 'GS-4102', 'GS-4104', 'SP-11', 'AX-11', 'GS-4103']);
    const first = within(row('GS-4101'));
    expect(first.getByRole('link', { name: 'GS-4101' }).getAttribute('href')).toBe('/parts/p1');
    expect(first.getByText('In service')).toBeTruthy();
    expect(first.getByText('RE-01 Ember rear end · in 714 Ember')).toBeTruthy();
    expect(first.getByText('due soon')).toBeTruthy();
    expect(within(row('GS-4102')).getByText('17 over')).toBeTruthy();
    expect(within(row('GS-4103')).getByText('Retired')).toBeTruthy();
    expect(within(row('GS-4104')).getByText('Not installed')).toBeTruthy();
  });

  it('filters by kind, by status and by text in the serial, together', async () => {
    const user = userEvent.setup();
    renderTable();
    await user.selectOptions(screen.getByLabelText('Kind'), 'gear-set');
    expect(serials()).toEqual(['GS-4101', 'GS-4102', 'GS-4104', 'GS-4103']);
    await user.selectOptions(screen.getByLabelText('Status'), 'in-service');
    expect(serials()).toEqual(['GS-4101', 'GS-4102']);
    expect(screen.getByText('Parts 1–2 of 2 (filtered from 6).')).toBeTruthy();
    await user.type(screen.getByLabelText('Serial contains'), '02');
    expect(serials()).toEqual(['GS-4102']);
    await user.click(screen.getByRole('button', { name: 'Clear filters' }));
    expect(serials()).toHaveLength(6);
    await user.type(screen.getByLabelText('Serial contains'), 'sp-');
    expect(serials()).toEqual(['SP-11']);
  });

  it('says so when nothing matches', async () => {
    const user = userEvent.setup();
    renderTable();
    await user.type(screen.getByLabelText('Serial contains'), 'ZZ');
    expect(serials()).toEqual([]);
    expect(screen.getByText('No parts match these filters.')).toBeTruthy();
  });

  it('sorts by runs left, fewest first, with the parts that have no limit last either way', async () => {
    const user = userEvent.setup();
    renderTable();
    const header = screen.getByRole('button', { name: /Runs left/ });
    await user.click(header);
    expect(serials()).toEqual(['GS-4102', 'GS-4101', 'GS-4103', 'SP-11', 'GS-4104', 'AX-11']);
    expect(header.closest('th')?.getAttribute('aria-sort')).toBe('ascending');
    await user.click(header);
    expect(serials()).toEqual(['GS-4104', 'SP-11', 'GS-4103', 'GS-4101', 'GS-4102', 'AX-11']);
    expect(header.closest('th')?.getAttribute('aria-sort')).toBe('descending');
  });

  it('sorts serials as people read them and statuses in their life order', async () => {
    const user = userEvent.setup();
    renderTable();
    await user.click(screen.getByRole('button', { name: /Serial/ }));
    expect(serials()).toEqual(['AX-11', 'GS-4101', 'GS-4102', 'GS-4103', 'GS-4104', 'SP-11']);
    await user.click(screen.getByRole('button', { name: /Status/ }));
    expect(serials()[0]).toBe('GS-4104');
    expect(serials().at(-1)).toBe('GS-4103');
  });

  it('pages through a long register 25 rows at a time', async () => {
    const user = userEvent.setup();
    const many = Array.from({ length: 30 }, (_, i) => part({ id: `b${i}`, serial: `BR-${String(i + 1).padStart(2, '0')}`, kind: 'bearing' }));
    renderTable(many);
    expect(serials()).toHaveLength(25);
    expect(screen.getByText('Parts 1–25 of 30.')).toBeTruthy();
    await user.click(screen.getByRole('button', { name: 'Next page' }));
    expect(serials()).toEqual(['BR-26', 'BR-27', 'BR-28', 'BR-29', 'BR-30']);
    expect(screen.getByText('Page 2 of 2')).toBeTruthy();
  });

  it('offers the add form only to a role that may add parts', () => {
    renderTable(PARTS, false);
    expect(screen.queryByRole('button', { name: 'Add a part' })).toBeNull();
    cleanup();
    renderTable(PARTS, true);
    expect(screen.getByRole('button', { name: 'Add a part' })).toBeTruthy();
  });
});
