import Papa from 'papaparse';

/**
 * A cell that a spreadsheet would read as a formula: one that begins with `=`, `+`, `-`, `@`, a tab or a
 * carriage return (OWASP's CSV-injection guidance). Papaparse's own default pattern ends in `.*$`, which
 * does not cross a line break, so a cell such as "=1+1\nx" would slip past it; this one looks at the
 * first character only.
 */
export const FORMULA_START = /^[=+\-@\t\r]/;

/**
 * Every CSV export's writer: papaparse with `escapeFormulae`, which puts a `'` before a text cell that
 * starts like a formula and quotes it. Numbers are not text, so a negative number stays a number.
 * @example toCsv({ fields: ['reason', 'runs'], data: [['=1+1', -3]] }) // 'reason,runs\n"\'=1+1",-3'
 */
export function toCsv(input: { fields: string[]; data: unknown[][] } | Record<string, unknown>[]): string {
  return Papa.unparse<unknown>(input, { newline: '\n', escapeFormulae: FORMULA_START });
}
