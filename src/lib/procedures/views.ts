import type { AppliedTorque, ProcedureSection } from './model';
import type { ChecklistStatus } from './checklist-rules';

/** A procedure as the API and the screens read it: one version's content. */
export interface ProcedureView {
  id: string;
  version: number;
  currentVersion: number;
  name: string;
  purpose: string | null;
  appliesTo: string | null;
  notes: string | null;
  sections: ProcedureSection[];
  archived: boolean;
  /** The demo's procedures: their torque figures are invented examples. */
  example: boolean;
  versionCreatedAt: string;
  updatedAt: string;
  photos: StepPhotoView[];
}

export interface ProcedureListItem {
  id: string;
  name: string;
  purpose: string | null;
  appliesTo: string | null;
  version: number;
  archived: boolean;
  updatedAt: string;
}

export interface StepPhotoView {
  id: string;
  stepId: string;
  url: string;
  thumbnailUrl: string;
  width: number;
  height: number;
}

/** One step's record on a checklist. */
export interface StepRecordView {
  stepId: string;
  status: 'done' | 'skipped';
  reason: string | null;
  torqueApplied: AppliedTorque[] | null;
  boltsInOrder: number[] | null;
  orderDeviation: boolean;
  value: number | null;
  valueUnit: string | null;
  note: string | null;
  by: { id: string; name: string };
  at: string;
}

export interface ChecklistView {
  id: string;
  status: ChecklistStatus;
  procedure: { id: string; name: string; version: number; example: boolean };
  sections: ProcedureSection[];
  assembly: { id: string; serial: string; name: string } | null;
  gearSet: { id: string; serial: string } | null;
  startedBy: { id: string; name: string };
  startedAt: string;
  completedAt: string | null;
  signedOff: { by: { id: string; name: string }; at: string; note: string | null } | null;
  steps: Record<string, StepRecordView>;
  photos: StepPhotoView[];
}

export interface ChecklistListItem {
  id: string;
  status: ChecklistStatus;
  procedureId: string;
  procedureName: string;
  version: number;
  assemblyId: string | null;
  gearSetId: string | null;
  startedAt: string;
  completedAt: string | null;
  signedOffAt: string | null;
  stepsRecorded: number;
  stepsTotal: number;
}
