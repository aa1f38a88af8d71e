import type { ApiClient } from './api-client';

/**
 * A procedure body as a crew chief would write one: a teardown section and a set-up section with a
 * 10-bolt ring-gear circle in three passes (thread-locker), a one-fastener pinion nut, a backlash
 * step and a note step. The figures are invented for tests. `ringGearStepId` keeps that step's id in a new version.
 */
export function procedureBody(
  name = 'Rear-end teardown and inspection',
  ringGearStepId?: string,
): Record<string, unknown> {
  return {
    name,
    purpose: 'Teardown and inspection',
    appliesTo: 'Rear ends with a 9-inch style housing',
    sections: [
      {
        title: 'Teardown',
        steps: [
          { title: 'Drain the oil', instructions: 'Let the housing **cool** first.', caution: 'Hot oil.' },
          { title: 'Check the turning torque', records: 'turning-torque' },
        ],
      },
      {
        title: 'Set-up',
        steps: [
          {
            ...(ringGearStepId ? { id: ringGearStepId } : {}),
            title: 'Ring gear bolts',
            fasteners: {
              count: 10,
              description: '7/16-20, grade 8',
              torque: { value: 55, unit: 'lbf-ft' },
              torqueSource: 'part maker’s sheet',
              passesPercent: [30, 70, 100],
              sequence: true,
              compound: { kind: 'thread-locker', note: 'medium strength' },
            },
          },
          {
            title: 'Pinion nut',
            fasteners: {
              count: 1,
              torque: { value: 200, unit: 'N-m' },
              torqueSource: 'part maker’s sheet',
            },
          },
          { title: 'Measure backlash', records: 'backlash' },
          { title: 'Close up', records: 'note' },
        ],
      },
    ],
  };
}

export interface MadeProcedure {
  id: string;
  version: number;
  sections: { id: string; title: string; steps: { id: string; title: string }[] }[];
}

/** The step ids of a procedure by title. */
export function stepIdsByTitle(procedure: MadeProcedure): Record<string, string> {
  return Object.fromEntries(procedure.sections.flatMap((s) => s.steps.map((step) => [step.title, step.id])));
}

/** Writes a procedure through the API; throws unless 201. */
export async function createProcedure(client: ApiClient, body = procedureBody()): Promise<MadeProcedure> {
  const made = await client.post<MadeProcedure>('/api/procedures', body);
  if (made.status !== 201) throw new Error(`making a procedure: ${made.status} ${JSON.stringify(made.body)}`);
  return made.body;
}

/** Starts a checklist through the API; throws unless 201. */
export async function startChecklist(
  client: ApiClient,
  body: { procedureId: string; assemblyId?: string; gearSetId?: string },
): Promise<string> {
  const made = await client.post<{ id: string }>('/api/checklists', body);
  if (made.status !== 201) throw new Error(`starting a checklist: ${made.status} ${JSON.stringify(made.body)}`);
  return made.body.id;
}

/** Uploads `bytes` as the multipart field `file` to a step's photo route. */
export async function uploadStepPhoto(
  client: ApiClient,
  path: string,
  bytes: Uint8Array,
  type = 'image/png',
): Promise<{ status: number; body: any }> {
  const form = new FormData();
  form.set('file', new Blob([new Uint8Array(bytes)], { type }), 'step.png');
  const response = await client.request(path, { method: 'POST', body: form });
  const text = await response.text();
  return { status: response.status, body: text ? JSON.parse(text) : null };
}
