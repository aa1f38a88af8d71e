import type { ApiClient } from './api-client';
import { uploadPhoto } from './images';
import { createInspection } from './inspections';
import { createProcedure, startChecklist, stepIdsByTitle, uploadStepPhoto } from './procedures';
import sharp from 'sharp';

/**
 * One of every kind of record in a team, made through the API, so that tests generated from the
 * route list have a real id for every [param] (the access matrix, the fuzzer, the headers test).
 */
export interface TeamRecords {
  teamId: string;
  carId: string;
  assemblyId: string;
  partId: string;
  gearSetId: string;
  runId: string;
  /** A draft recorded by `author`. */
  inspectionId: string;
  photoId: string;
  reviewId: string;
  profileId: string;
  /** A member of the team other than the manager (for /api/members/[userId]). */
  memberId: string;
  /** An open invitation, to nobody in particular. */
  invitationId: string;
  /** A procedure by `manager`, its 10-bolt step (with a tightening order), a checklist on it by `author`, a step photo. */
  procedureId: string;
  procedureStepId: string;
  checklistId: string;
  stepPhotoId: string;
}

let serial = 0;
/** A serial no other record in this test process has. */
export function freshSerial(prefix = 'REC'): string {
  serial += 1;
  return `${prefix}-${Date.now().toString(36)}-${serial}`;
}

async function created(answer: Promise<{ status: number; body: any }>, what: string): Promise<string> {
  const { status, body } = await answer;
  if (status !== 201 || typeof body?.id !== 'string')
    throw new Error(`making ${what}: ${status} ${JSON.stringify(body).slice(0, 300)}`);
  return body.id;
}

/** A small real PNG, quick to re-encode. */
export function smallPng(): Promise<Buffer> {
  return sharp({ create: { width: 48, height: 32, channels: 3, background: { r: 200, g: 120, b: 40 } } })
    .png()
    .toBuffer();
}

/** Makes a car, assembly, part, gear set, run and review with `manager` (owner or crew chief), and a draft with a photo by `author`. */
export async function makeTeamRecords(
  manager: ApiClient,
  author: ApiClient,
  ids: { teamId: string; memberId: string },
): Promise<TeamRecords> {
  const carId = await created(manager.post('/api/cars', { name: freshSerial('Car') }), 'a car');
  const assemblyId = await created(
    manager.post('/api/assemblies', { serial: freshSerial('AS'), name: 'Rear end' }),
    'an assembly',
  );
  const partId = await created(manager.post('/api/parts', { kind: 'bearing', serial: freshSerial('BR') }), 'a part');
  const gearSetId = await created(
    manager.post('/api/gear-sets', { serial: freshSerial('GS'), ringTeeth: 41, pinionTeeth: 10 }),
    'a gear set',
  );
  const runId = await created(manager.post('/api/runs', { carId, at: '2026-06-01T10:00:00Z' }), 'a run');
  const inspectionId = await createInspection(author, gearSetId);
  const photo = await uploadPhoto(author, inspectionId, await smallPng(), { type: 'image/png', filename: 'p.png' });
  if (photo.status !== 201) throw new Error(`making a photo: ${photo.status} ${JSON.stringify(photo.body)}`);
  const reviewId = await created(manager.post('/api/reviews', { gearSetId }), 'a review');
  const invitationId = await created(
    manager.post('/api/invitations', {
      email: `${freshSerial('invited').toLowerCase()}@lashline.test`,
      role: 'viewer',
    }),
    'an invitation',
  );
  const profiles = await manager.get<{ items: { profileId: string }[] }>('/api/tolerance-profiles');
  const profileId = profiles.body.items[0]?.profileId;
  if (!profileId) throw new Error(`no tolerance profile: ${JSON.stringify(profiles.body)}`);
  const procedure = await createProcedure(manager);
  const procedureStepId = stepIdsByTitle(procedure)['Ring gear bolts']!;
  const checklistId = await startChecklist(author, { procedureId: procedure.id, assemblyId, gearSetId });
  const stepPhoto = await uploadStepPhoto(
    manager,
    `/api/procedures/${procedure.id}/steps/${procedureStepId}/photos`,
    await smallPng(),
  );
  if (stepPhoto.status !== 201)
    throw new Error(`making a step photo: ${stepPhoto.status} ${JSON.stringify(stepPhoto.body)}`);
  return {
    procedureId: procedure.id,
    procedureStepId,
    checklistId,
    stepPhotoId: stepPhoto.body.id as string,
    teamId: ids.teamId,
    memberId: ids.memberId,
    carId,
    assemblyId,
    partId,
    gearSetId,
    runId,
    inspectionId,
    photoId: photo.body.id as string,
    reviewId,
    profileId,
    invitationId,
  };
}

/** The values for every [param] of a route (API or page) from a team's records; the first path segment names the kind. */
export function recordsToParams(records: TeamRecords, pattern: string): Record<string, string> {
  const path = pattern.replace(/^\/api/, '').replace(/^\/exports/, '');
  const byPrefix: [string, string][] = [
    ['/cars/', records.carId],
    ['/assemblies/', records.assemblyId],
    ['/parts/', records.partId],
    ['/gear-sets/', records.gearSetId],
    ['/tolerance-profiles/for-gear-set/', records.gearSetId],
    ['/tolerance-profiles/', records.profileId],
    ['/inspections/', records.inspectionId],
    ['/photos/', records.photoId],
    ['/reviews/', records.reviewId],
    ['/runs/', records.runId],
    ['/teams/', records.teamId],
    ['/invitations/', records.invitationId],
    ['/procedures/', records.procedureId],
    ['/checklists/', records.checklistId],
    ['/step-photos/', records.stepPhotoId],
  ];
  const id = byPrefix.find(([prefix]) => path.startsWith(prefix))?.[1];
  return {
    ...(id === undefined ? {} : { id }),
    photoId: records.photoId,
    userId: records.memberId,
    stepId: records.procedureStepId,
  };
}
