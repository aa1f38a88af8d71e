import type { RowProblem } from '../../lib/register/run-import';
import type { FileCheck } from './read-run-file';

/** The schema's field names as the file's columns say them. */
const FIELD_TO_COLUMN: Record<string, string> = {
  carId: 'car',
  elapsedSeconds: 'elapsed_seconds',
  speedMph: 'speed_mph',
};
const columnOf = (field: string) => FIELD_TO_COLUMN[field] ?? field;
const PREVIEW_ROWS = 12;
const LISTED_PROBLEMS = 300;

/** What the file holds: the rows with problems (line, column, message) and the first rows as read. */
export function ImportPreview({ check }: { check: FileCheck }) {
  const problemsByLine = new Map(check.problems.map((p) => [p.line, p]));
  const rowProblems: { line: number; column: string; message: string }[] = check.problems.flatMap((p: RowProblem) =>
    Object.entries(p.fields).map(([field, message]) => ({ line: p.line, column: columnOf(field), message })),
  );
  return (
    <div className="flex flex-col gap-4">
      {rowProblems.length > 0 && (
        <div>
          <h3 className="mb-1 font-bold" id="import-problems-heading">
            Problems
          </h3>
          <div className="overflow-x-auto" role="region" aria-labelledby="import-problems-heading" tabIndex={0}>
            <table className="data-table" data-testid="import-problems">
              <thead>
                <tr>
                  <th scope="col" className="num">
                    Line
                  </th>
                  <th scope="col">Column</th>
                  <th scope="col">Problem</th>
                </tr>
              </thead>
              <tbody>
                {rowProblems.slice(0, LISTED_PROBLEMS).map((p, index) => (
                  <tr key={`${p.line}-${p.column}-${index}`}>
                    <td className="num">{p.line}</td>
                    <td>
                      <code>{p.column}</code>
                    </td>
                    <td>{p.message}</td>
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
          {rowProblems.length > LISTED_PROBLEMS && (
            <p className="mt-1 text-ink-soft">…and {rowProblems.length - LISTED_PROBLEMS} more problems not listed.</p>
          )}
        </div>
      )}
      {check.records.length > 0 && (
        <div>
          <h3 className="mb-1 font-bold" id="import-rows-heading">
            {check.records.length > PREVIEW_ROWS ? `The first ${PREVIEW_ROWS} rows` : 'The rows'}
          </h3>
          <div className="overflow-x-auto" role="region" aria-labelledby="import-rows-heading" tabIndex={0}>
            <table className="data-table min-w-[44rem]">
              <thead>
                <tr>
                  <th scope="col" className="num">
                    Line
                  </th>
                  <th scope="col">Check</th>
                  <th scope="col">car</th>
                  <th scope="col">at</th>
                  <th scope="col">event</th>
                  <th scope="col">round</th>
                  <th scope="col">lane</th>
                  <th scope="col" className="num">
                    elapsed_seconds
                  </th>
                  <th scope="col" className="num">
                    speed_mph
                  </th>
                </tr>
              </thead>
              <tbody>
                {check.records.slice(0, PREVIEW_ROWS).map((record, index) => {
                  const line = index + 2;
                  const bad = problemsByLine.has(line);
                  return (
                    <tr key={line} className={bad ? 'bg-alarm-wash' : undefined}>
                      <td className="num">{line}</td>
                      <td className="font-semibold">{bad ? '✕ problem' : '✓ ready'}</td>
                      <td>{record.car}</td>
                      <td>{record.at}</td>
                      <td>{record.event}</td>
                      <td>{record.round}</td>
                      <td>{record.lane}</td>
                      <td className="num">{record.elapsed_seconds}</td>
                      <td className="num">{record.speed_mph}</td>
                    </tr>
                  );
                })}
              </tbody>
            </table>
          </div>
        </div>
      )}
    </div>
  );
}
