/**
 * The inspection's date and time typed in one field, in the device's local time: a whole date and time,
 * a date alone (that day at noon, as the API reads a plain date), a time alone (today), or "now". One
 * field instead of a date-time control whose seven parts each take a Tab press.
 */
const pad = (n: number) => String(n).padStart(2, '0');

/** @example dateToWhenText(new Date(2026, 4, 3, 14, 30)) // '2026-05-03 14:30' */
export function dateToWhenText(date: Date): string {
  return `${date.getFullYear()}-${pad(date.getMonth() + 1)}-${pad(date.getDate())} ${pad(date.getHours())}:${pad(date.getMinutes())}`;
}

function localDate(year: number, month: number, day: number, hour: number, minute: number): Date | null {
  if (month < 1 || month > 12 || hour > 23 || minute > 59) return null;
  const date = new Date(year, month - 1, day, hour, minute);
  // new Date rolls 31 April over into May: a day the month does not have is no date.
  return date.getDate() === day && date.getMonth() === month - 1 ? date : null;
}

/**
 * Reads what was typed, or null when it is not a date and time.
 * @example parseWhenText('2026-05-03 14:30', now) // 3 May 2026, 14:30 local
 * @example parseWhenText('7:05', now)             // today, 07:05 local
 * @example parseWhenText('2026-05-03', now)       // 3 May 2026, 12:00 local
 */
export function parseWhenText(text: string, now: Date): Date | null {
  const typed = text.trim().toLowerCase();
  if (typed === 'now') return new Date(Math.floor(now.getTime() / 60_000) * 60_000);
  const time = /^(\d{1,2})[:.h](\d{2})$/.exec(typed) ?? /^(\d{2})(\d{2})$/.exec(typed);
  if (time) return localDate(now.getFullYear(), now.getMonth() + 1, now.getDate(), Number(time[1]), Number(time[2]));
  const full = /^(\d{4})-(\d{1,2})-(\d{1,2})(?:[ t]+(\d{1,2})[:.h]?(\d{2}))?$/.exec(typed);
  if (!full) return null;
  const [, year, month, day, hour, minute] = full;
  return localDate(Number(year), Number(month), Number(day), hour ? Number(hour) : 12, minute ? Number(minute) : 0);
}

export const WHEN_TEXT_HINT = 'Date and time as 2026-05-03 14:30, a time alone for today, or “now”.';
