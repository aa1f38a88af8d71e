import Papa from 'papaparse';
import { checkRunRecords, type RowProblem } from '../../lib/register/run-import';

/**
 * Reads a runs CSV in chunks (so a large file shows progress and never freezes the tablet) and
 * checks every row with `checkRunRecords`, the check the import endpoint runs. The parse options
 * and line numbers are those of `parseRunCsv`: the header is line 1, blank lines are skipped.
 */
export interface FileCheck {
  /** Every record as read, in file order; record i is on line i + 2. */
  records: Record<string, string>[];
  /** One entry per line with a problem, fields merged, sorted by line. */
  problems: RowProblem[];
  /** False when the header lacks a needed column: then no row can be imported. */
  headerOk: boolean;
}

const CHUNK_BYTES = 256 * 1024;

function mergeByLine(problems: RowProblem[]): RowProblem[] {
  const byLine = new Map<number, Record<string, string>>();
  for (const p of problems) byLine.set(p.line, { ...byLine.get(p.line), ...p.fields });
  return [...byLine.entries()].sort((a, b) => a[0] - b[0]).map(([line, fields]) => ({ line, fields }));
}

export function readRunFile(
  file: File | string,
  cars: readonly { id: string; name: string }[],
  now: Date,
  onProgress: (share: number) => void,
): Promise<FileCheck> {
  const size = typeof file === 'string' ? file.length : file.size;
  return new Promise((resolve, reject) => {
    const records: Record<string, string>[] = [];
    const problems: RowProblem[] = [];
    let headerOk = true;
    let headerChecked = false;
    Papa.parse<Record<string, string>>(file as File, {
      header: true,
      skipEmptyLines: 'greedy',
      transformHeader: (h) => h.trim().toLowerCase(),
      chunkSize: CHUNK_BYTES,
      chunk: (results, parser) => {
        if (!headerChecked) {
          headerChecked = true;
          const missing = ['car', 'at'].filter((column) => !results.meta.fields?.includes(column));
          if (missing.length) {
            headerOk = false;
            problems.push({
              line: 1,
              fields: { header: `The header needs the column${missing.length > 1 ? 's' : ''} ${missing.join(', ')}.` },
            });
            parser.abort();
            return;
          }
        }
        const firstLine = 2 + records.length;
        for (const error of results.errors)
          problems.push({ line: 2 + (error.row ?? records.length), fields: { file: error.message } });
        problems.push(...checkRunRecords(results.data, cars, now, firstLine).problems);
        records.push(...results.data);
        onProgress(size ? Math.min(1, results.meta.cursor / size) : 1);
      },
      complete: () => {
        onProgress(1);
        resolve({ records, problems: mergeByLine(problems), headerOk });
      },
      error: (error) => reject(error),
    });
  });
}

/** The records to send: every one whose line has no problem, without papaparse's overflow cells. */
export function keptRecords(check: FileCheck): Record<string, string>[] {
  const bad = new Set(check.problems.map((p) => p.line));
  return check.records.filter((_, index) => !bad.has(index + 2)).map(({ __parsed_extra: _extra, ...record }) => record);
}
