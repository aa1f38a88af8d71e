// @vitest-environment jsdom
import { afterEach, describe, expect, it, vi } from 'vitest';
import { cleanup, render, screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import ImportRuns from '../../../src/components/runs/ImportRuns';

afterEach(cleanup);

const CARS = [
  { id: 'c1', name: '714 Ember' },
  { id: 'c2', name: '22 Blackwater' },
];
// Invented runs (2025, well in the past): lines 3, 4 and 5 each have one problem.
const CSV = [
  'car,at,event,round,lane,elapsed_seconds,speed_mph,notes',
  '714 Ember,2025-11-07T15:12:00Z,Dry Lake,Q1,left,5.962,248.31,',
  '99 Nobody,2025-11-07T15:20:00Z,Dry Lake,Q1,right,6.402,220.87,',
  '22 Blackwater,2025-11-07T17:49:00Z,Dry Lake,Q2,left,fast,222.14,',
  '714 Ember,yesterday,Dry Lake,E1,left,5.951,248.77,',
  '22 Blackwater,2025-11-08T13:14:00Z,Dry Lake,E1,right,6.455,219.62,Lifted early',
].join('\n');

async function chooseFile(text: string, send = vi.fn()) {
  const user = userEvent.setup();
  const onImported = vi.fn();
  render(<ImportRuns cars={CARS} onImported={onImported} send={send} />);
  await user.upload(screen.getByLabelText('Choose a CSV file'), new File([text], 'runs.csv', { type: 'text/csv' }));
  await screen.findByTestId('import-summary');
  return { user, send, onImported };
}

const problemRows = () =>
  within(screen.getByTestId('import-problems'))
    .getAllByRole('row')
    .slice(1)
    .map((tr) =>
      within(tr)
        .getAllByRole('cell')
        .map((td) => td.textContent),
    );

describe('the import preview', () => {
  it('lists every row with a problem by line, column and message', async () => {
    await chooseFile(CSV);
    expect(screen.getByTestId('import-summary').textContent).toBe('runs.csv: 5 rows read — 2 ready, 3 with problems.');
    expect(problemRows()).toEqual([
      ['3', 'car', 'No car called “99 Nobody” in this team.'],
      ['4', 'elapsed_seconds', 'Elapsed time must be a number.'],
      ['5', 'at', 'Give the time as an ISO date-time, e.g. 2026-05-03T14:20:00Z.'],
    ]);
  });

  it('sends nothing while rows have problems, until they are left out', async () => {
    const send = vi.fn(async (records: Record<string, string>[]) => ({
      ok: true as const,
      status: 201,
      data: { imported: records.length, checked: records.length },
    }));
    const { user, onImported } = await chooseFile(CSV, send);
    const importButton = screen.getByRole('button', { name: 'Import 2 runs' });
    expect((importButton as HTMLButtonElement).disabled).toBe(true);
    const leaveOut = screen.getByRole('checkbox', { name: 'Leave out the 3 rows with problems' });
    await user.click(leaveOut);
    expect((importButton as HTMLButtonElement).disabled).toBe(false);
    await user.click(importButton);
    expect(send).toHaveBeenCalledTimes(1);
    const sent = send.mock.calls[0]![0];
    // The kept rows go as read from the file, for the endpoint to check again.
    expect(sent.map((r) => [r.car, r.at, r.notes])).toEqual([
      ['714 Ember', '2025-11-07T15:12:00Z', ''],
      ['22 Blackwater', '2025-11-08T13:14:00Z', 'Lifted early'],
    ]);
    expect(await screen.findByText('Imported 2 runs. Every part’s count includes them.')).toBeTruthy();
    expect(onImported).toHaveBeenCalledWith(2);
  });

  it('refuses a file whose header lacks the car or the time', async () => {
    await chooseFile('vehicle,when\n714 Ember,2025-11-07T15:12:00Z\n');
    expect(screen.getByTestId('import-summary').textContent).toBe(
      'runs.csv cannot be imported: The header needs the columns car, at.',
    );
    expect(screen.queryByRole('checkbox')).toBeNull();
  });

  it('offers a clean file for import at once', async () => {
    await chooseFile(
      CSV.split('\n')
        .filter((_, i) => i === 0 || i === 1 || i === 5)
        .join('\n'),
    );
    expect(screen.getByTestId('import-summary').textContent).toBe('runs.csv: 2 rows read — 2 ready, 0 with problems.');
    expect(screen.queryByRole('checkbox')).toBeNull();
    expect(screen.getByRole<HTMLButtonElement>('button', { name: 'Import 2 runs' }).disabled).toBe(false);
  });

  it('counts lines the way the server does when a row is malformed', async () => {
    await chooseFile(
      `${CSV.split('\n').slice(0, 2).join('\n')}\n\n22 Blackwater,2025-11-08T13:14:00Z,Dry Lake,E1,right,6.455,219.62,late,extra\n`,
    );
    // The blank line is skipped, so the malformed row is the second record: line 3.
    expect(problemRows()).toEqual([['3', 'file', 'Too many fields: expected 8 fields but parsed 9']]);
  });
});
