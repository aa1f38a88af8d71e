// Inspections as the server hands them to pages, islands and the API's clients: plain shapes, no
// database. The use-cases in lib/server/inspections build them; anything in the browser may import them.

import type { DEFAULT_PROFILE_SOURCES, ToleranceProfile } from '../analysis/tolerance';
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
