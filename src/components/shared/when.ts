/**
 * Times on screen. The server renders in UTC and says so; once the island runs, times read in the
 * tablet's own time zone (the track's), so hydration never disagrees with the server's HTML.
 */
const pad = (n: number) => String(n).padStart(2, '0');

/** @example isoToUtcText('2026-10-24T13:05:00.000Z') // '2026-10-24 13:05 UTC' */
export function isoToUtcText(iso: string): string {
  return `${iso.slice(0, 10)} ${iso.slice(11, 16)} UTC`;
}

/** A short local date and time, e.g. "Sat 24 Oct 2026, 15:05". */
export function isoToLocalText(iso: string): string {
  return new Date(iso).toLocaleString(undefined, {
    weekday: 'short',
    day: 'numeric',
    month: 'short',
    year: 'numeric',
    hour: '2-digit',
    minute: '2-digit',
  });
}

export function isoToText(iso: string, local: boolean): string {
  return local ? isoToLocalText(iso) : isoToUtcText(iso);
}

/** The value of a datetime-local input for `date`, in local time. */
export function dateToLocalInput(date: Date): string {
  return `${date.getFullYear()}-${pad(date.getMonth() + 1)}-${pad(date.getDate())}T${pad(date.getHours())}:${pad(date.getMinutes())}`;
}

/** A datetime-local value as an ISO instant, or null when it is not a time. */
export function localInputToIso(value: string): string | null {
  if (!value) return null;
  const date = new Date(value);
  return Number.isNaN(date.getTime()) ? null : date.toISOString();
}
