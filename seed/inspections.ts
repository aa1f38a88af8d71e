import { randomUUID } from 'node:crypto';
import { write } from '../src/db/client';
import { inspections } from '../src/db/schema';
import { draftToData } from '../src/lib/inspections/record';
import { inspectionDraftSchema } from '../src/lib/inspections/schemas';
import { ensureDefaultProfile, profileForGearSet } from '../src/lib/server/inspections/profiles';
import { countRunsForPart } from '../src/lib/server/register/run-counts';
import type { SeededPeople } from './people';
import type { SeededRegister } from './register';
import { seededRandom } from './random';

/**
 * The demo inspections: invented readings that tell three stories. GS-4101 drifts loose over the
 * summer; GS-4102 shows a growing once-per-turn wave and back-face runout; GS-4103 came out early
 * with spalling. Readings are in inches on a 0.001 in indicator unless noted.
 */
interface Story {
  serial: string;
  dates: string[];
  /** Mean backlash (in) and once-per-turn amplitude (in) at the n-th inspection. */
  lash: (n: number) => { mean: number; wave: number };
  runout: (n: number) => number;
  positions: number;
  resolution?: '0.001in' | '0.0005in';
  extra?: (n: number, last: boolean) => Record<string, unknown>;
}

const STORIES: Story[] = [
  {
    serial: 'GS-4101',
    dates: ['2026-05-12', '2026-06-01', '2026-06-29', '2026-08-03', '2026-08-31', '2026-09-28', '2026-10-26'],
    lash: (n) => ({ mean: 0.0064 + n * 0.00036, wave: 0.0004 }),
    runout: () => 0.0012,
    positions: 4,
    extra: (n) => ({
      patterns: {
        drive: { along: 0.5 + n * 0.03, up: 0.5, length: 0.45 },
        coast: { along: 0.45, up: 0.5, length: 0.4 },
      },
    }),
  },
  {
    serial: 'GS-4102',
    dates: ['2026-03-01', '2026-04-06', '2026-05-18', '2026-06-29', '2026-08-03', '2026-09-14', '2026-10-26'],
    lash: (n) => ({ mean: 0.0072, wave: 0.0003 + n * 0.00028 }),
    runout: (n) => 0.0014 + n * 0.00035,
    positions: 8,
    resolution: '0.0005in',
    extra: (n) => ({
      patterns: { drive: { along: 0.5, up: 0.5 + n * 0.02, length: 0.4 }, coast: { along: 0.5, up: 0.5, length: 0.4 } },
      notes: n >= 5 ? 'Pattern wanders round the gear; check ring-gear seating.' : undefined,
    }),
  },
  {
    serial: 'GS-4103',
    dates: ['2026-03-01', '2026-04-06', '2026-05-11'],
    lash: (n) => ({ mean: 0.0068 + n * 0.0003, wave: 0.0003 }),
    runout: () => 0.001,
    positions: 4,
    extra: (_n, last) =>
      last
        ? {
            condition: {
              teeth: [
                { finding: 'spalling', severity: 'severe' },
                { finding: 'pitting', severity: 'moderate' },
              ],
              splines: 'none',
              bearings: 'light',
              seals: 'none',
            },
            notes: 'Spalling on three drive-side teeth near the heel. Out of service.',
          }
        : {},
  },
  {
    serial: 'GS-4106',
    dates: ['2026-03-01', '2026-07-21'],
    lash: () => ({ mean: 0.0075, wave: 0.0003 }),
    runout: () => 0.001,
    positions: 4,
  },
];

const round = (value: number, step: number) => Math.round(value / step) * step;

export async function seedInspections(people: SeededPeople, register: SeededRegister): Promise<void> {
  const { teamId } = people;
  await ensureDefaultProfile(teamId);
  const random = seededRandom(4101);
  for (const story of STORIES) {
    const gearSetId = register.gearSetIds[story.serial]!;
    const profile = await profileForGearSet(teamId, gearSetId);
    const step = story.resolution === '0.0005in' ? 0.0005 : 0.001;
    for (const [n, date] of story.dates.entries()) {
      const inspectedAt = new Date(`${date}T16:00:00Z`);
      const { totalRuns } = await countRunsForPart(teamId, gearSetId, inspectedAt.getTime());
      const { mean, wave } = story.lash(n);
      const readings = Array.from({ length: story.positions }, (_, k) => {
        const theta = (2 * Math.PI * k) / story.positions;
        return Number(round(mean + wave * Math.cos(theta - 1.1) + (random() - 0.5) * step * 0.8, step).toFixed(4));
      });
      const last = n === story.dates.length - 1;
      const draft = inspectionDraftSchema.parse({
        gearSetId,
        assemblyId: null,
        inspectedAt: inspectedAt.toISOString(),
        runsAtInspection: totalRuns,
        unit: 'in',
        resolution: story.resolution ?? '0.001in',
        torqueUnit: 'lbf-in',
        readings,
        runout: { backFace: Number(round(story.runout(n), step / 2).toFixed(5)) },
        pinion: { shims: [0.03, 0.005, 0.003], depthChange: n === 0 ? 0 : null, marking: '+2' },
        carrierShims: { left: 0.06, right: 0.055 },
        preload: {
          pinionTorque: n === 0 ? 26 : 10 + Math.round(random()),
          bearings: n === 0 ? 'new' : 'used',
          hubLeft: { unchanged: true },
          hubRight: { unchanged: true },
        },
        ...story.extra?.(n, last),
      });
      const technicianId = n % 2 ? people.userIds.technician : people.userIds['crew-chief'];
      await write(async (tx) => {
        await tx.insert(inspections).values({
          id: randomUUID(),
          teamId,
          gearSetId,
          status: 'submitted',
          inspectedAt,
          runsAtInspection: totalRuns,
          data: draftToData(draft),
          profileVersionId: profile.versionId,
          technicianId,
          createdBy: technicianId,
          submittedAt: inspectedAt,
          submittedBy: technicianId,
          updatedAt: inspectedAt,
        });
      });
    }
  }
}
