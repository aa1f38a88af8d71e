import { useId, useState } from 'react';
import type { RowProblem } from '../../lib/register/run-import';
import { RUN_CSV_COLUMNS } from '../../lib/register/run-import';
import type { Answer } from '../shared/api';
import { ImportPreview } from './ImportPreview';
import { keptRecords, readRunFile, type FileCheck } from './read-run-file';
import { sendRunRecords, type ImportAnswer } from './send-run-records';

const MAX_ROWS = 20_000;
const MAX_BYTES = 5 * 1024 * 1024;

interface Props {
  cars: readonly { id: string; name: string }[];
  onImported: (count: number) => void;
  /** Sends the kept records; the real one posts them to /api/runs/import with upload progress. */
  send?: (records: Record<string, string>[], onProgress: (share: number) => void) => Promise<Answer<ImportAnswer>>;
}

type Phase =
  | { name: 'idle' }
  | { name: 'reading'; share: number }
  | { name: 'checked' }
  | { name: 'sending'; share: number }
  | { name: 'done'; imported: number };

/**
 * Import: read and check the whole file here, show what is wrong line by line, and send only the
 * rows that pass. While any row has a problem nothing is sent, unless those rows are left out.
 */
export default function ImportRuns({ cars, onImported, send = sendRunRecords }: Props) {
  const id = useId();
  const [phase, setPhase] = useState<Phase>({ name: 'idle' });
  const [fileName, setFileName] = useState('');
  const [check, setCheck] = useState<FileCheck | null>(null);
  const [leaveOut, setLeaveOut] = useState(false);
  const [problem, setProblem] = useState('');
  const [serverProblems, setServerProblems] = useState<RowProblem[]>([]);

  const choose = async (file: File | undefined) => {
    if (!file) return;
    setFileName(file.name);
    setCheck(null);
    setLeaveOut(false);
    setProblem('');
    setServerProblems([]);
    setPhase({ name: 'reading', share: 0 });
    try {
      const result = await readRunFile(file, cars, new Date(), (share) => setPhase({ name: 'reading', share }));
      setCheck(result);
      setPhase({ name: 'checked' });
    } catch (error) {
      setPhase({ name: 'idle' });
      setProblem(`The file could not be read: ${error instanceof Error ? error.message : String(error)}`);
    }
  };

  const bad = check?.problems.length ?? 0;
  const kept = check ? keptRecords(check) : [];
  const blocked = !check || !check.headerOk || kept.length === 0 || (bad > 0 && !leaveOut);

  const importRows = async () => {
    if (blocked) return;
    if (kept.length > MAX_ROWS)
      return setProblem(
        `One import takes at most ${MAX_ROWS.toLocaleString()} rows; this file has ${kept.length.toLocaleString()}. Split it and import each part.`,
      );
    if (JSON.stringify({ records: kept }).length > MAX_BYTES)
      return setProblem('These rows come to more than 5 MB; split the file and import each part.');
    setProblem('');
    setPhase({ name: 'sending', share: 0 });
    const answer = await send(kept, (share) => setPhase({ name: 'sending', share }));
    if (answer.ok) {
      setPhase({ name: 'done', imported: answer.data.imported });
      onImported(answer.data.imported);
      return;
    }
    setPhase({ name: 'checked' });
    setProblem(answer.problem.message);
    // A 422 lists each line of what was sent; nothing was written.
    setServerProblems(
      Object.entries(answer.problem.fields).map(([key, text]) => ({
        line: Number(key.replace(/\D/g, '')) || 0,
        fields: { row: text },
      })),
    );
  };

  return (
    <div className="flex flex-col gap-4">
      <details className="rounded-md border border-rule p-3">
        <summary className="min-h-11 cursor-pointer font-semibold">What the file needs</summary>
        <p className="mt-2">
          A header line with the columns <code>{RUN_CSV_COLUMNS.join(', ')}</code>; only <code>car</code> and{' '}
          <code>at</code> are required. <code>car</code> is the car’s name exactly as on the cars page; <code>at</code>{' '}
          is a date and time with its offset, e.g. <code>2026-11-07T14:20:00Z</code>.
        </p>
      </details>
      <p>
        <a href="/samples/runs-sample.csv" download>
          Download a sample file
        </a>{' '}
        (ten invented runs for the demo cars) to see the layout.
      </p>

      <div className="flex flex-col gap-1">
        <label htmlFor={`${id}-file`}>Choose a CSV file</label>
        <input
          id={`${id}-file`}
          type="file"
          accept=".csv,text/csv"
          className="!border-dashed file:mr-3 file:min-h-11 file:cursor-pointer file:rounded-md file:border-0 file:bg-petrol file:px-4 file:font-semibold file:text-white"
          disabled={phase.name === 'reading' || phase.name === 'sending'}
          onChange={(e) => void choose(e.target.files?.[0])}
        />
      </div>

      {phase.name === 'reading' && (
        <div role="status">
          <label htmlFor={`${id}-reading`}>Reading and checking {fileName}…</label>
          <progress id={`${id}-reading`} className="progress-bar" max={100} value={Math.round(phase.share * 100)}>
            {Math.round(phase.share * 100)}%
          </progress>
        </div>
      )}

      {check && phase.name !== 'reading' && (
        <>
          <p className={`notice ${bad ? 'notice-caution' : ''}`} role="status" data-testid="import-summary">
            {check.headerOk
              ? `${fileName}: ${check.records.length} row${check.records.length === 1 ? '' : 's'} read — ${check.records.length - bad} ready, ${bad} with problems.`
              : `${fileName} cannot be imported: ${check.problems[0]?.fields.header ?? 'the header is not right.'}`}
          </p>
          <ImportPreview check={check} />
          {check.headerOk && bad > 0 && kept.length > 0 && (
            <label className="flex min-h-11 items-center gap-3 font-semibold">
              <input
                type="checkbox"
                className="h-6 !min-h-0 !w-6"
                checked={leaveOut}
                onChange={(e) => setLeaveOut(e.target.checked)}
                disabled={phase.name === 'sending'}
              />
              Leave out the {bad} row{bad === 1 ? '' : 's'} with problems
            </label>
          )}
          {phase.name !== 'done' && (
            <div className="flex flex-wrap items-center gap-3">
              <button
                type="button"
                className="btn"
                onClick={() => void importRows()}
                disabled={blocked || phase.name === 'sending'}
              >
                {phase.name === 'sending' ? 'Importing…' : `Import ${kept.length} run${kept.length === 1 ? '' : 's'}`}
              </button>
              {check.headerOk && bad > 0 && !leaveOut && kept.length > 0 && (
                <p className="text-ink-soft">
                  Nothing is imported while rows have problems: fix the file and choose it again, or leave those rows
                  out.
                </p>
              )}
              {check.headerOk && kept.length === 0 && check.records.length > 0 && (
                <p className="text-ink-soft">No row is ready to import.</p>
              )}
              {check.records.length === 0 && check.headerOk && (
                <p className="text-ink-soft">The file has no rows under its header.</p>
              )}
            </div>
          )}
        </>
      )}

      {phase.name === 'sending' && (
        <div role="status">
          <label htmlFor={`${id}-sending`}>{phase.share < 1 ? 'Sending the rows…' : 'Saving on the server…'}</label>
          {phase.share < 1 ? (
            <progress id={`${id}-sending`} className="progress-bar" max={100} value={Math.round(phase.share * 100)} />
          ) : (
            <progress id={`${id}-sending`} className="progress-bar" />
          )}
        </div>
      )}

      {phase.name === 'done' && (
        <p className="notice" role="status">
          Imported {phase.imported} run{phase.imported === 1 ? '' : 's'}. Every part’s count includes them.
        </p>
      )}

      {problem && (
        <div className="notice notice-error" role="alert">
          <p>{problem}</p>
          {serverProblems.length > 0 && (
            <ul className="mt-1 list-disc pl-5">
              {serverProblems.slice(0, 20).map((p) => (
                <li key={p.line}>
                  Sent row {p.line}: {p.fields.row}
                </li>
              ))}
            </ul>
          )}
        </div>
      )}
    </div>
  );
}
