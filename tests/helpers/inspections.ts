import type { ApiClient } from './api-client';

const SHEET = {
  inspectedAt: '2026-06-01T10:00:00Z',
  runsAtInspection: 12,
  unit: 'in',
  resolution: '0.001in',
  readings: [0.009, 0.01, 0.011],
} as const;

/** A draft inspection of `gearSetId`, recorded through POST /api/inspections by `client`'s person in their current team. */
export async function createInspection(client: ApiClient, gearSetId: string): Promise<string> {
  const made = await client.post('/api/inspections', { gearSetId, ...SHEET });
  if (made.status !== 201) throw new Error(`POST /api/inspections: ${made.status} ${JSON.stringify(made.body)}`);
  return made.body.id as string;
}
