// Inspections as the server hands them to pages, islands and the API's clients: plain shapes, no
// database. The use-cases in lib/server/inspections build them; anything in the browser may import them.

import type { DEFAULT_PROFILE_SOURCES, ToleranceProfile } from '../analysis/tolerance';
import type { LatestDecisionView } from '../reviews/latest-decision';
import type { ComparisonShape } from '../charts/comparison';
import type { GearSetChartInput } from '../charts/gear-set-input';
import type { PartHistoryEntry, PartView } from '../register/views';
import type { GearSetAnalysis } from './gear-set-analysis';
import type { PhotoSide } from '../photos/upload-rules';
import type { dataToEntry, InspectionData } from './record';
import type { InspectionSummary } from './summary';

/** An inspection as the API answers it: what was typed, the canonical record, and the summary in the reader's units. */
export interface InspectionView extends ReturnType<typeof dataToEntry> {
  id: string;
  gearSetId: string;
  assemblyId: string | null;
  status: 'draft' | 'submitted';
  inspectedAt: string;
  runsAtInspection: number;
  technicianId: string | null;
  createdBy: string;
  submittedAt: string | null;
  profileVersionId: string | null;
  revision: number;
  updatedAt: string;
  canonical: InspectionData;
  summary: InspectionSummary;
}

/** One version of a tolerance profile: what an inspection is judged by. */
export interface ProfileView {
  profileId: string;
  versionId: string;
  version: number;
  name: string;
  isDefault: boolean;
  values: ToleranceProfile;
  sources: typeof DEFAULT_PROFILE_SOURCES;
  createdAt: string;
}

/** A photo of an inspection, with the addresses of its two sizes. */
export interface PhotoView {
  id: string;
  side: PhotoSide;
  url: string;
  thumbnailUrl: string;
  width: number;
  height: number;
  createdAt: string;
}

/** A stored gear set's analysis as GET /api/gear-sets/:id/analysis answers it, in the reader's units. */
export type StoredAnalysis = GearSetAnalysis & {
  gearSetId: string;
  unit: string;
  torqueUnit: string;
  profile: { name: string; version: number };
};

/** Everything the gear set page and its compare page show, read in one go. */
export interface GearSetPageView {
  set: PartView;
  analysis: StoredAnalysis;
  /** The submitted inspections, oldest first, in the reader's units. */
  inspections: InspectionView[];
  drafts: number;
  profile: ProfileView;
  car: { id: string; name: string } | null;
  serviceIntervalRuns: number;
  chartInput: GearSetChartInput;
  /** The set's open review, if it has one. */
  openReviewId: string | null;
  /** The set's latest decision and its re-inspection point, or null when none was made. */
  decision: LatestDecisionView | null;
  renderedAt: number;
}

/** Everything the inspection page shows, read in one go. */
export interface InspectionPageView {
  view: InspectionView;
  gearSet: PartView;
  /** The profile it is judged by: the version kept at submission, else the set's current one. */
  profile: ProfileView;
  photos: PhotoView[];
  technician: string | null;
  assembly: { serial: string; name: string } | null;
  canEdit: boolean;
  /** The change since the set's previous inspection (null for the first). */
  change: { previousId: string; comparison: ComparisonShape } | null;
}

/** A part's page: the part, where it is, its history and, for a gear set, its inspections newest first. */
export interface PartPageView {
  part: PartView;
  /** Where it is, naming the car as well as the assembly. */
  where: string;
  serviceIntervalRuns: number;
  /** A gear set's latest decision and its re-inspection point, or null. */
  decision: LatestDecisionView | null;
  history: PartHistoryEntry[];
  inspections: InspectionView[];
}
