import { lazy, Suspense, useState } from 'react';
import type { RunView } from '../../lib/register/views';
import { callApi, type Page } from '../shared/api';
import { LogRunForm, type RunCar } from './LogRunForm';
import { runKey } from './run-form';
import { RecentRuns, type RunViewer } from './RecentRuns';

// Papaparse, zod and the shared run check load only when someone opens the import.
const ImportRuns = lazy(() => import('./ImportRuns'));

export interface RunsIslandProps {
  teamId: string;
  cars: RunCar[];
  initialPage: Page<RunView>;
  canRecord: boolean;
  canEdit: boolean;
  /** Who is looking: a technician may delete the runs they logged in the last 24 hours. */
  viewer: RunViewer;
}

const PAGE_PATH = '/api/runs?limit=50';
const byNewest = (a: RunView, b: RunView) => b.at.localeCompare(a.at) || b.id.localeCompare(a.id);

/** The runs page: log a run, read and correct the log, import a file. */
export default function RunsIsland({ teamId, cars, initialPage, canRecord, canEdit, viewer }: RunsIslandProps) {
  const [runs, setRuns] = useState(initialPage.items);
  const [cursor, setCursor] = useState(initialPage.nextCursor);
  const [loading, setLoading] = useState(false);
  const [listProblem, setListProblem] = useState('');
  const [importing, setImporting] = useState(false);
  const lastEvent = runs.find((r) => r.event)?.event ?? null;

  const load = async (next: string | null) => {
    setLoading(true);
    setListProblem('');
    const answer = await callApi<Page<RunView>>(next ? `${PAGE_PATH}&cursor=${encodeURIComponent(next)}` : PAGE_PATH);
    setLoading(false);
    if (!answer.ok) return setListProblem(answer.problem.message);
    setRuns((current) =>
      next ? [...current, ...answer.data.items.filter((r) => !current.some((c) => c.id === r.id))] : answer.data.items,
    );
    setCursor(answer.data.nextCursor);
  };
  const upsert = (run: RunView) =>
    setRuns((current) => [run, ...current.filter((r) => r.id !== run.id)].sort(byNewest));

  return (
    <div className="flex flex-col gap-6">
      {canRecord && (
        <section aria-labelledby="log-heading" className="card">
          <h2 id="log-heading" className="mb-3">
            Log a run
          </h2>
          <LogRunForm
            cars={cars}
            lastEvent={lastEvent}
            draftKey={`lashline:run-draft:${teamId}`}
            send={(body) =>
              callApi<RunView>('/api/runs', { method: 'POST', body, headers: { 'Idempotency-Key': runKey(body) } })
            }
            onSaved={upsert}
          />
        </section>
      )}

      {canRecord && (
        <section aria-labelledby="import-heading" className="card">
          <h2 id="import-heading" className="mb-2">
            Import runs from a file
          </h2>
          {importing ? (
            <Suspense fallback={<p role="status">Loading the import…</p>}>
              <ImportRuns cars={cars} onImported={() => void load(null)} />
            </Suspense>
          ) : (
            <>
              <p className="mb-3">
                A CSV file with one run a line, from a timing system or a spreadsheet. Every row is checked on this
                device before anything is sent.
              </p>
              <button type="button" className="btn" onClick={() => setImporting(true)}>
                Import a CSV file
              </button>
            </>
          )}
        </section>
      )}
      <section aria-labelledby="recent-heading" className="card">
        <div className="mb-2 flex flex-wrap items-center justify-between gap-2">
          <h2 id="recent-heading">Recent runs</h2>
          <button type="button" className="btn btn-quiet" onClick={() => void load(null)} disabled={loading}>
            {loading ? 'Loading…' : 'Refresh'}
          </button>
        </div>
        {listProblem && (
          <p className="notice notice-error mb-2" role="alert">
            {listProblem}
          </p>
        )}
        <RecentRuns
          runs={runs}
          cars={cars}
          canEdit={canEdit}
          viewer={viewer}
          onChanged={upsert}
          onDeleted={(id) => setRuns((current) => current.filter((r) => r.id !== id))}
        />
        {cursor && (
          <button type="button" className="btn btn-quiet mt-3" onClick={() => void load(cursor)} disabled={loading}>
            {loading ? 'Loading…' : 'Show older runs'}
          </button>
        )}
      </section>
    </div>
  );
}
