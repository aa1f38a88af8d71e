import type { ApiClient } from './api-client';

/** A minimal valid draft body in inches, for the given gear set. */
export function draftBody(gearSetId: string, overrides: Record<string, unknown> = {}): Record<string, unknown> {
  return {
    gearSetId,
    inspectedAt: '2026-06-01T12:00:00Z',
    runsAtInspection: 10,
    unit: 'in',
    resolution: '0.001in',
    readings: [0.008, 0.007, 0.006, 0.007],
    ...overrides,
  };
}

let keyCounter = 0;
/** A fresh Idempotency-Key. */
export function newKey(): string {
  keyCounter += 1;
  return `key-${Date.now()}-${keyCounter}`;
}

/** Creates and submits an inspection; returns its id. */
export async function submitInspection(client: ApiClient, body: Record<string, unknown>): Promise<string> {
  const created = await client.request('/api/inspections', {
    method: 'POST',
    headers: { 'content-type': 'application/json', 'idempotency-key': newKey() },
    body: JSON.stringify(body),
  });
  const draft = (await created.json()) as { id: string };
  if (created.status !== 201) throw new Error(`create failed ${created.status}: ${JSON.stringify(draft)}`);
  const submitted = await client.request(`/api/inspections/${draft.id}/submit`, {
    method: 'POST',
    headers: { 'idempotency-key': newKey() },
  });
  if (submitted.status !== 200) throw new Error(`submit failed ${submitted.status}: ${await submitted.text()}`);
  return draft.id;
}

/** A draft inspection of `gearSetId`, recorded through POST /api/inspections by `client`'s person in their current team. */
export async function createInspection(client: ApiClient, gearSetId: string): Promise<string> {
  const body = draftBody(gearSetId, {
    inspectedAt: '2026-06-01T10:00:00Z',
    runsAtInspection: 12,
    readings: [0.009, 0.01, 0.011],
  });
  const made = await client.post('/api/inspections', body);
  if (made.status !== 201) throw new Error(`POST /api/inspections: ${made.status} ${JSON.stringify(made.body)}`);
  return made.body.id as string;
}
