import { randomUUID } from 'node:crypto';
import { and, asc, desc, eq } from 'drizzle-orm';
import type { z } from 'zod';
import { getDb, write } from '../../../db/client';
import { parts, toleranceProfileVersions, type ToleranceProfileVersion } from '../../../db/schema';
import { DEFAULT_PROFILE, DEFAULT_PROFILE_SOURCES, type ToleranceProfile } from '../../analysis/tolerance';
import type { profileCreateSchema, profileUpdateSchema } from '../../inspections/profile-schema';
import type { TeamAccess } from '../guard';
import { HttpError } from '../http';
import { recordAudit } from '../audit';
import type { ProfileView } from '../../inspections/views';

export type { ProfileView };

const DEFAULT_NAME = 'Team default';

function defaultValues(): ToleranceProfile {
  const { sources: _sources, ...values } = DEFAULT_PROFILE;
  return values;
}

/** A stored profile version as the API answers it. */
export function profileRowToView(row: ToleranceProfileVersion, defaultProfileId: string): ProfileView {
  return {
    profileId: row.profileId,
    versionId: row.id,
    version: row.version,
    name: row.name,
    isDefault: row.profileId === defaultProfileId,
    values: row.values,
    sources: DEFAULT_PROFILE_SOURCES,
    createdAt: row.createdAt.toISOString(),
  };
}

// A team's default profile is its first, and profiles are never deleted, so once found its id never changes
// (a deleted team takes its profiles with it, and team ids are never reused). Keeping it saves a query on
// every profile lookup — three in a gear set's analysis.
const DEFAULT_PROFILE_IDS = new Map<string, string>();

/** The id of the team's default profile, made from the published defaults the first time it is needed. */
export async function ensureDefaultProfile(teamId: string): Promise<string> {
  const known = DEFAULT_PROFILE_IDS.get(teamId);
  if (known) return known;
  const db = await getDb();
  const first = await db
    .select({ profileId: toleranceProfileVersions.profileId })
    .from(toleranceProfileVersions)
    .where(eq(toleranceProfileVersions.teamId, teamId))
    .orderBy(asc(toleranceProfileVersions.createdAt))
    .limit(1)
    .get();
  const profileId =
    first?.profileId ??
    (await write(async (tx) => {
      const again = await tx
        .select()
        .from(toleranceProfileVersions)
        .where(eq(toleranceProfileVersions.teamId, teamId))
        .limit(1)
        .get();
      if (again) return again.profileId;
      const made = randomUUID();
      await tx
        .insert(toleranceProfileVersions)
        .values({ id: randomUUID(), teamId, profileId: made, version: 1, name: DEFAULT_NAME, values: defaultValues() });
      return made;
    }));
  DEFAULT_PROFILE_IDS.set(teamId, profileId);
  return profileId;
}

/** The newest version of every profile of the team. */
export async function listProfiles(teamId: string): Promise<ProfileView[]> {
  const defaultId = await ensureDefaultProfile(teamId);
  const db = await getDb();
  const rows = await db
    .select()
    .from(toleranceProfileVersions)
    .where(eq(toleranceProfileVersions.teamId, teamId))
    .orderBy(asc(toleranceProfileVersions.name), desc(toleranceProfileVersions.version));
  const newest = new Map<string, ToleranceProfileVersion>();
  for (const row of rows) if (!newest.has(row.profileId)) newest.set(row.profileId, row);
  return [...newest.values()].map((row) => profileRowToView(row, defaultId));
}

/** The newest version of one profile; 404 for another team's. */
export async function getProfile(teamId: string, profileId: string): Promise<ProfileView> {
  const found = (await listProfiles(teamId)).find((p) => p.profileId === profileId);
  if (!found) throw new HttpError(404, 'No such tolerance profile in this team.');
  return found;
}

/** One exact version (what an inspection was judged by). */
export async function getProfileVersion(teamId: string, versionId: string): Promise<ProfileView> {
  const defaultId = await ensureDefaultProfile(teamId);
  const db = await getDb();
  const row = await db
    .select()
    .from(toleranceProfileVersions)
    .where(and(eq(toleranceProfileVersions.id, versionId), eq(toleranceProfileVersions.teamId, teamId)))
    .get();
  if (!row) throw new HttpError(404, 'No such profile version in this team.');
  return profileRowToView(row, defaultId);
}

/** Every version of a profile, newest first. */
export async function listProfileVersions(teamId: string, profileId: string): Promise<ProfileView[]> {
  const defaultId = await ensureDefaultProfile(teamId);
  const db = await getDb();
  const rows = await db
    .select()
    .from(toleranceProfileVersions)
    .where(and(eq(toleranceProfileVersions.profileId, profileId), eq(toleranceProfileVersions.teamId, teamId)))
    .orderBy(desc(toleranceProfileVersions.version));
  if (!rows.length) throw new HttpError(404, 'No such tolerance profile in this team.');
  return rows.map((row) => profileRowToView(row, defaultId));
}

/** The profile a gear set is judged by now: its own, or the team default. */
export async function profileForGearSet(teamId: string, gearSetId: string): Promise<ProfileView> {
  const db = await getDb();
  const set = await db
    .select({ profileId: parts.toleranceProfileId, kind: parts.kind })
    .from(parts)
    .where(and(eq(parts.id, gearSetId), eq(parts.teamId, teamId)))
    .get();
  if (!set || set.kind !== 'gear-set') throw new HttpError(404, 'No such gear set in this team.');
  return getProfile(teamId, set.profileId ?? (await ensureDefaultProfile(teamId)));
}

export async function createProfile(
  access: TeamAccess,
  input: z.infer<typeof profileCreateSchema>,
): Promise<ProfileView> {
  await ensureDefaultProfile(access.team.id);
  const profileId = randomUUID();
  await write(async (tx) => {
    const id = randomUUID();
    await tx.insert(toleranceProfileVersions).values({
      id,
      teamId: access.team.id,
      profileId,
      version: 1,
      name: input.name,
      values: input.values,
      createdBy: access.user.id,
    });
    await recordAudit(tx, {
      teamId: access.team.id,
      actorId: access.user.id,
      action: 'create',
      recordType: 'tolerance-profile',
      recordId: profileId,
      after: input,
    });
  });
  return getProfile(access.team.id, profileId);
}

/** Editing adds a version; inspections already judged keep the version they were judged by. */
export async function updateProfile(
  access: TeamAccess,
  profileId: string,
  input: z.infer<typeof profileUpdateSchema>,
): Promise<ProfileView> {
  const current = await getProfile(access.team.id, profileId);
  await write(async (tx) => {
    await tx.insert(toleranceProfileVersions).values({
      id: randomUUID(),
      teamId: access.team.id,
      profileId,
      version: current.version + 1,
      name: input.name ?? current.name,
      values: input.values,
      createdBy: access.user.id,
    });
    await recordAudit(tx, {
      teamId: access.team.id,
      actorId: access.user.id,
      action: 'new-version',
      recordType: 'tolerance-profile',
      recordId: profileId,
      before: current.values,
      after: input.values,
    });
  });
  return getProfile(access.team.id, profileId);
}
