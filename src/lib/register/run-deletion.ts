import { roleCan, type Role } from '../roles';

/** How long the person who logged a run may take it back themselves: a run logged by mistake is noticed the same day. */
export const OWN_RUN_DELETE_WINDOW_MS = 24 * 60 * 60 * 1000;

export interface RunAuthorship {
  recordedBy: string | null;
  /** When the run was logged (not when it was raced). */
  createdAt: Date;
}

/**
 * Whether `userId`, holding `role`, may delete a run: crew chiefs and owners always; whoever logged it
 * (a technician) within 24 hours of logging it; nobody else.
 * @example mayDeleteRun('technician', 'u1', { recordedBy: 'u1', createdAt: hourAgo }, now) // true
 */
export function mayDeleteRun(role: Role, userId: string, run: RunAuthorship, now: Date): boolean {
  if (roleCan(role, 'runs:edit')) return true;
  if (!roleCan(role, 'runs:record') || run.recordedBy !== userId) return false;
  const age = now.getTime() - run.createdAt.getTime();
  return age >= 0 && age < OWN_RUN_DELETE_WINDOW_MS;
}
