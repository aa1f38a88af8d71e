import { IN_USE_STATUSES, type BoardFilter } from './board';

/**
 * The board's filter as two rows of links, one per car and one per status: one tap shows the result,
 * with no dropdown to open and no Show button, and it works without JavaScript. Each link keeps the
 * other row's choice; "all" leaves its key out, so the plain board stays `/`.
 */
export const BOARD_PATH = '/';

export interface FilterChoice {
  label: string;
  href: string;
  /** The choice the board shows now: marked for the eye and, as aria-current, for a screen reader. */
  current: boolean;
}

/** @example boardFilterHref({ car: 'c1', status: null }, { status: 'spare' }) // '/?car=c1&status=spare' */
export function boardFilterHref(filter: BoardFilter, changes: Partial<BoardFilter> = {}): string {
  const next = { ...filter, ...changes };
  const params = new URLSearchParams();
  if (next.car) params.set('car', next.car);
  if (next.status) params.set('status', next.status);
  const query = params.toString();
  return query ? `${BOARD_PATH}?${query}` : BOARD_PATH;
}

/** All cars, each car by name, then sets in no car. */
export function carChoices(filter: BoardFilter, cars: readonly { id: string; name: string }[]): FilterChoice[] {
  const options: { car: string | null; label: string }[] = [
    { car: null, label: 'All cars' },
    ...cars.map((c) => ({ car: c.id, label: c.name })),
    { car: 'none', label: 'Not in a car' },
  ];
  return options.map((o) => ({
    label: o.label,
    href: boardFilterHref(filter, { car: o.car }),
    current: filter.car === o.car,
  }));
}

/** Any status in use, then each one by its label. */
export function statusChoices(
  filter: BoardFilter,
  labels: Readonly<Record<(typeof IN_USE_STATUSES)[number], string>>,
): FilterChoice[] {
  const options: { status: BoardFilter['status']; label: string }[] = [
    { status: null, label: 'Any in use' },
    ...IN_USE_STATUSES.map((s) => ({ status: s, label: labels[s] })),
  ];
  return options.map((o) => ({
    label: o.label,
    href: boardFilterHref(filter, { status: o.status }),
    current: filter.status === o.status,
  }));
}
