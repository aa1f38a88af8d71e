import { OUT_OF_USE, PART_STATUS_LABELS } from '../register/kinds';
import type { PartStatus } from '../register/kinds';

export interface PickableGearSet {
  id: string;
  serial: string;
  ratioLabel?: string | null;
  status: string;
}

/**
 * The sets the sheet's picker offers: none retired or scrapped (nothing is inspected after it leaves
 * service) except the one already chosen, and only those whose serial holds what was typed in the search.
 * @example pickableGearSets(sets, '41', null) // the sets in use whose serial contains "41"
 */
export function pickableGearSets<T extends PickableGearSet>(
  sets: readonly T[],
  query: string,
  chosenId: string | null,
): T[] {
  const wanted = query.trim().toLowerCase();
  return sets.filter(
    (set) =>
      set.id === chosenId ||
      (!OUT_OF_USE.includes(set.status as PartStatus) && (!wanted || set.serial.toLowerCase().includes(wanted))),
  );
}

/** The option's words: serial, ratio, and the state in words unless the set is in service. */
export function gearSetOptionLabel(set: PickableGearSet): string {
  const state =
    set.status === 'in-service'
      ? ''
      : ` · ${(PART_STATUS_LABELS[set.status as PartStatus] ?? set.status).toLowerCase()}`;
  return `${set.serial}${set.ratioLabel ? ` · ${set.ratioLabel}` : ''}${state}`;
}
