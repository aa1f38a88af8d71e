import { announceRunThresholds } from './run-thresholds';

/**
 * Runs changed: queue the threshold and re-inspection notices. A failure here is logged and never
 * undoes the runs, which are already committed; the next run logged looks again.
 */
export async function afterRunsChanged(teamId: string, baseUrl: string): Promise<void> {
  try {
    await announceRunThresholds(teamId, baseUrl);
  } catch (error) {
    console.error('[lashline] could not queue run notices', error);
  }
}
