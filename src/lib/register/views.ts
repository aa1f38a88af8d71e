// The register as the server hands it to pages, islands and the API's clients: plain shapes, no database.
// The use-cases in lib/server/register build them; anything in the browser may import them.

import type { PartKind, PartStatus } from './kinds';

/** One part with its derived run counts and where it is now. */
export interface PartView {
  id: string;
  kind: PartKind;
  serial: string;
  status: PartStatus;
  lifeLimitRuns: number | null;
  runsSinceInstall: number;
  totalRuns: number;
  /** Runs left to the life limit, counted on the part's whole life; null without a limit. */
  runsLeft: number | null;
  maker: string | null;
  model: string | null;
  material: string | null;
  notes: string | null;
  location: { targetType: 'assembly' | 'car'; targetId: string; label: string; since: string } | null;
  ringTeeth?: number | null;
  pinionTeeth?: number | null;
  ratio?: number | null;
  ratioLabel?: string | null;
  pressureAngleDeg?: number | null;
  /** Gear sets: how the teeth were cut, and the runout factor as a spiral angle or a typed k. */
  cutMethod?: 'face-milled' | 'face-hobbed' | 'unknown';
  spiralAngleDeg?: number | null;
  runoutK?: number | null;
  createdAt: string;
}

/** A car and its run totals. */
export interface CarView {
  id: string;
  name: string;
  carClass: string | null;
  notes: string | null;
  totalRuns: number;
  lastRunAt: string | null;
  createdAt: string;
}

/** A rear-end assembly, the car it is in and the parts it holds now. */
export interface AssemblyView {
  id: string;
  serial: string;
  name: string;
  housing: string | null;
  notes: string | null;
  carId: string | null;
  partIds: string[];
  createdAt: string;
}

/** The names of the places a part can be: what a location label or a board row reads. */
export interface PlaceNames {
  cars: { id: string; name: string }[];
  assemblies: { id: string; serial: string; name: string; carId: string | null }[];
}

/** One run of the log (the idempotency key stays on the server). */
export interface RunView {
  id: string;
  carId: string;
  at: string;
  event: string | null;
  round: string | null;
  lane: string | null;
  notes: string | null;
  elapsedSeconds: number | null;
  speedMph: number | null;
  recordedBy: string | null;
  createdAt: string;
}

/** One row of a part's installation history, newest first, each place named and who recorded it. */
export interface PartHistoryEntry {
  id: string;
  action: 'install' | 'remove';
  targetLabel: string;
  at: string;
  actorName: string | null;
  notes: string | null;
}
