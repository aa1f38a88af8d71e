import { useState } from 'react';
import type { RunView } from '../../lib/register/views';
import { mayDeleteRun } from '../../lib/register/run-deletion';
import type { Role } from '../../lib/roles';
import { callApi, messageWithoutField } from '../shared/api';
import { ConfirmAction } from '../shared/ConfirmAction';
import { useHydrated } from '../shared/use-hydrated';
import { isoToText } from '../shared/when';
import { LogRunForm, type RunCar } from './LogRunForm';

/** The person reading the log, for the runs they may take back themselves. */
export interface RunViewer {
  userId: string;
  role: Role;
}

interface Props {
  runs: RunView[];
  cars: RunCar[];
  canEdit: boolean;
  viewer: RunViewer;
  onChanged: (run: RunView) => void;
  onDeleted: (runId: string) => void;
}

const measure = (value: number | null, unit: string) => (value === null ? null : `${value} ${unit}`);

/** The run log, newest first; a crew chief or owner can correct or delete a run, its logger delete it for a day. */
export function RecentRuns({ runs, cars, canEdit, viewer, onChanged, onDeleted }: Props) {
  const hydrated = useHydrated();
  const [editing, setEditing] = useState<string | null>(null);
  const [deleting, setDeleting] = useState<string | null>(null);
  const [problem, setProblem] = useState<{ runId: string; text: string } | null>(null);
  const carName = (id: string) => cars.find((c) => c.id === id)?.name ?? 'a car no longer listed';
  // Decided again at each render: the 24-hour window closes while the page stays open.
  const deletable = (run: RunView) =>
    mayDeleteRun(
      viewer.role,
      viewer.userId,
      { recordedBy: run.recordedBy, createdAt: new Date(run.createdAt) },
      new Date(),
    );

  if (runs.length === 0) return <p>No runs logged yet.</p>;
  return (
    <ol className="flex flex-col divide-y divide-rule">
      {runs.map((run) => {
        const details = [run.event, run.round, run.lane ? `${run.lane} lane` : null].filter(Boolean).join(' · ');
        const figures = [measure(run.elapsedSeconds, 's'), measure(run.speedMph, 'mph')].filter(Boolean).join(' · ');
        return (
          <li key={run.id} className="py-2" data-testid="run-row">
            <div className="flex flex-wrap items-start justify-between gap-3">
              <div className="min-w-52 flex-1">
                <p>
                  <strong className="text-lg">{carName(run.carId)}</strong> ·{' '}
                  <time dateTime={run.at}>{isoToText(run.at, hydrated)}</time>
                </p>
                <p className="flex flex-wrap gap-x-4">
                  {details && <span>{details}</span>}
                  {figures && <span className="font-semibold tabular-nums">{figures}</span>}
                </p>
                {run.notes && <p className="text-ink-soft">{run.notes}</p>}
              </div>
              {(canEdit || deletable(run)) && editing !== run.id && (
                <div className="flex flex-wrap gap-2">
                  {canEdit && (
                    <button
                      type="button"
                      className="btn btn-quiet"
                      onClick={() => setEditing(run.id)}
                      aria-label={`Edit the run of ${carName(run.carId)} at ${isoToText(run.at, hydrated)}`}
                    >
                      Edit
                    </button>
                  )}
                  <ConfirmAction
                    label="Delete"
                    ariaLabel={`Delete the run of ${carName(run.carId)} at ${isoToText(run.at, hydrated)}`}
                    question={`Delete this run? Every part that was in ${carName(run.carId)} loses it from its count.`}
                    confirmLabel="Yes, delete the run"
                    busy={deleting === run.id}
                    onConfirm={async () => {
                      setDeleting(run.id);
                      const answer = await callApi(`/api/runs/${encodeURIComponent(run.id)}`, { method: 'DELETE' });
                      setDeleting(null);
                      if (answer.ok || answer.problem.status === 404) onDeleted(run.id);
                      else setProblem({ runId: run.id, text: messageWithoutField(answer.problem) });
                    }}
                  />
                </div>
              )}
            </div>
            {problem?.runId === run.id && (
              <p className="notice notice-error mt-2" role="alert">
                {problem.text}
              </p>
            )}
            {editing === run.id && (
              <div className="mt-3 rounded-md border-2 border-petrol p-3">
                <LogRunForm
                  cars={cars}
                  run={run}
                  send={(body) =>
                    callApi<RunView>(`/api/runs/${encodeURIComponent(run.id)}`, { method: 'PATCH', body })
                  }
                  onSaved={(saved) => {
                    setEditing(null);
                    onChanged(saved);
                  }}
                  onCancel={() => setEditing(null)}
                />
              </div>
            )}
          </li>
        );
      })}
    </ol>
  );
}
