import { analyseGearSet, type GearSetAnalysis } from '../../inspections/gear-set-analysis';
import { summariseInspection, type ReaderUnits } from '../../inspections/summary';
import { lengthFiguresToMm, type LengthFigures } from '../../analysis/published-limits';
import { publishedLimitsOf, type ToleranceProfile } from '../../analysis/tolerance';
import { mmToLength } from '../../units';
import { HttpError } from '../http';
import { getPart } from '../register/parts';
import { readTeamSettings } from '../register/team-settings';
import { listSubmittedForAnalysis } from './inspections';
import { listProfileVersions, profileForGearSet } from './profiles';

/** The analysis of a stored gear set: each submitted inspection judged by the profile version it kept. */
export async function analyseStoredGearSet(
  teamId: string,
  gearSetId: string,
  units: ReaderUnits,
): Promise<
  GearSetAnalysis & { gearSetId: string; unit: string; torqueUnit: string; profile: { name: string; version: number } }
> {
  const set = await getPart(teamId, gearSetId);
  if (set.kind !== 'gear-set') throw new HttpError(404, 'No such gear set in this team.');
  const [rows, profile, settings] = await Promise.all([
    listSubmittedForAnalysis(teamId, gearSetId),
    profileForGearSet(teamId, gearSetId),
    readTeamSettings(teamId),
  ]);
  const versions = new Map((await listProfileVersions(teamId, profile.profileId)).map((v) => [v.versionId, v.values]));
  const geometry = {
    ringTeeth: set.ringTeeth ?? null,
    pinionTeeth: set.pinionTeeth ?? null,
    pressureAngleDeg: set.pressureAngleDeg ?? null,
    cutMethod: set.cutMethod ?? 'unknown',
    spiralAngleDeg: set.spiralAngleDeg ?? null,
    runoutK: set.runoutK ?? null,
  };
  const inspections = [];
  for (const row of rows) {
    // An inspection judged by a version of another profile (the set changed profile) falls back to the current one.
    const values: ToleranceProfile = (row.profileVersionId && versions.get(row.profileVersionId)) || profile.values;
    const data = row.data;
    inspections.push({
      id: row.id,
      inspectedAt: row.inspectedAt.toISOString(),
      runsAtInspection: row.runsAtInspection,
      data,
      summary: summariseInspection(data, values, geometry, units),
    });
  }
  // The trend limits as published in the reader's unit where printed (0.005 in, never 0.00512).
  const published = publishedLimitsOf(profile.values);
  const limitIn = (figures: LengthFigures) =>
    figures[units.lengthUnit] !== undefined
      ? Number(figures[units.lengthUnit])
      : mmToLength(lengthFiguresToMm(figures), units.lengthUnit);
  const analysis = analyseGearSet({
    inspections,
    limits: {
      backlashMin: limitIn(published.backlashMin),
      backlashMax: limitIn(published.backlashMax),
      maxSpread: limitIn(published.maxSpread),
    },
    totalRuns: set.totalRuns,
    runsSinceInstall: set.runsSinceInstall,
    lifeLimitRuns: set.lifeLimitRuns,
    serviceIntervalRuns: settings.serviceIntervalRuns,
  });
  return {
    gearSetId,
    unit: units.lengthUnit,
    torqueUnit: units.torqueUnit,
    profile: { name: profile.name, version: profile.version },
    ...analysis,
  };
}
