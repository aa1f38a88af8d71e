// The board as its read model hands it to the page: plain shapes, no database.

import type { LatestDecisionView } from '../reviews/latest-decision';
import type { BoardFilter, BoardRow } from './board';

/** A board row with what its sparkline draws: mean backlash at each inspection, and the band. */
export interface BoardEntry extends BoardRow {
  spark: { points: { runs: number; value: number }[]; band: { min: number; max: number } | null };
  /** The set's latest decision and its re-inspection point, or null when none was made. */
  decision: LatestDecisionView | null;
}

export interface BoardView {
  /** Every gear set the team has, retired and scrapped included (for the honest empty state). */
  gearSetCount: number;
  filter: BoardFilter;
  cars: { id: string; name: string }[];
  serviceIntervalRuns: number;
  unit: string;
  /** The sets in use the filter keeps (spares only when the filter asks for them), most urgent first. */
  rows: BoardEntry[];
  /** How many more rows match than are shown; they are behind `showAllHref`. */
  moreRows: number;
  /** "6 sets, most urgent first: 1 retire, 2 keep." */
  summaryText: string;
  spares: {
    ready: BoardEntry[];
    moreReady: number;
    notReady: { serial: string; href: string; why: string }[];
  };
  /** The same board with every row shown, when some are left out; null when nothing is. */
  showAllHref: string | null;
  /** What was typed in the board's serial search (`?q=`), or '' when nothing. */
  serialQuery: string;
}
