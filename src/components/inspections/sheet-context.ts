import type { InspectionViewLite } from './inspection-api';
import type { SourceNote, ToleranceProfile } from '../../lib/analysis/tolerance';
import type { Role } from '../../lib/roles';
import type { LengthUnit } from '../../lib/units';

/** What the sheet knows about the gear set it is for, from GET /api/gear-sets/:id. */
export interface GearSetInfo {
  id: string;
  serial: string;
  ringTeeth?: number | null;
  pinionTeeth?: number | null;
  ratioLabel?: string | null;
  pressureAngleDeg?: number | null;
  /** How the teeth were cut, and the runout factor as a spiral angle or a typed k (absent on older answers). */
  cutMethod?: 'face-milled' | 'face-hobbed' | 'unknown';
  spiralAngleDeg?: number | null;
  runoutK?: number | null;
  totalRuns: number;
  runsSinceInstall: number;
  location: { targetType: 'assembly' | 'car'; targetId: string; label: string } | null;
}

/** GET /api/tolerance-profiles/for-gear-set/:id. */
export interface ProfileInfo {
  profileId: string;
  versionId: string;
  version: number;
  name: string;
  values: ToleranceProfile;
  sources: Partial<Record<keyof ToleranceProfile, SourceNote>>;
}

/** Per-set context, kept with the local draft so a reload without a connection still judges. */
export interface SheetContext {
  gearSet: GearSetInfo | null;
  profile: ProfileInfo | null;
}

/** The person at the tablet, as the page knows them. */
export interface SheetUser {
  id: string;
  name: string;
  lengthUnit: LengthUnit;
  torqueUnit: 'lbf-in' | 'N-m';
}

/** What the page renders into the island: team-wide lists that do not depend on the query string. */
export interface SheetProps {
  mode: 'new' | 'edit';
  /** The inspection being edited (edit mode), as GET /api/inspections/:id answers it. */
  inspection?: InspectionViewLite;
  user: SheetUser;
  role: Role;
  /** May change submitted inspections (crew chief, owner). */
  canEditAny: boolean;
  gearSets: { id: string; serial: string; ratioLabel?: string | null; status: string }[];
  assemblies: { id: string; serial: string; name: string }[];
  members: { id: string; name: string }[];
  positionsDefault: number;
}
