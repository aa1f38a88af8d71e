import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { and, desc, eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import type { TeamAccess } from '../../../src/lib/server/guard';

/**
 * Each screen's read model sends the same number of statements to the database with the demo as with a
 * season more of data (seed/season.ts: 100 more gear sets, 2,180 more inspections, 5,000 runs, 200
 * reviews), counted by the database module's own counter (LASHLINE_COUNT_QUERIES=1, countQueries()) on a
 * real SQLite file built by the real migrator. A loader that reads once per set, per inspection or per
 * place would count more at the season and fail here.
 */

type Modules = Awaited<ReturnType<typeof load>>;

async function load() {
  return {
    client: await import('../../../src/db/client'),
    migrate: await import('../../../src/db/migrate'),
    schema: await import('../../../src/db/schema'),
    demo: await import('../../../seed/demo'),
    season: await import('../../../seed/season'),
    board: await import('../../../src/lib/server/board/read-board'),
    gearSet: await import('../../../src/lib/server/inspections/read-gear-set'),
    inspection: await import('../../../src/lib/server/inspections/read-inspection'),
    parts: await import('../../../src/lib/server/register/read-parts-page'),
    review: await import('../../../src/lib/server/reviews/read-review'),
  };
}

let folder: string;
let m: Modules;
let access: TeamAccess;
let seeded: NonNullable<Awaited<ReturnType<Modules['demo']['seedDemo']>>['demo']>;

interface Screen {
  queries: number;
  /** Something the screen shows, so a count over an empty answer cannot pass. */
  size: number;
}

async function findIds(serial: string): Promise<{ gearSetId: string; inspectionId: string; reviewId: string }> {
  const db = await m.client.getDb();
  const { parts, inspections, reviews } = m.schema;
  const teamId = access.team.id;
  const set = await db
    .select({ id: parts.id })
    .from(parts)
    .where(and(eq(parts.teamId, teamId), eq(parts.serial, serial)))
    .get();
  const latest = await db
    .select({ id: inspections.id })
    .from(inspections)
    .where(eq(inspections.gearSetId, set!.id))
    .orderBy(desc(inspections.inspectedAt))
    .get();
  // A review of this set when it has one (the season's sets do), else the team's first.
  const review =
    (await db.select({ id: reviews.id }).from(reviews).where(eq(reviews.gearSetId, set!.id)).get()) ??
    (await db.select({ id: reviews.id }).from(reviews).where(eq(reviews.teamId, teamId)).get());
  return { gearSetId: set!.id, inspectionId: latest!.id, reviewId: review!.id };
}

async function measure(serial: string): Promise<Record<string, Screen>> {
  const ids = await findIds(serial);
  const count = m.client.countQueries;
  const board = await count(() => m.board.readBoard(access, new URLSearchParams()));
  const gearSet = await count(() => m.gearSet.readGearSet(access, ids.gearSetId));
  const inspection = await count(() => m.inspection.readInspection(access, ids.inspectionId));
  const parts = await count(() => m.parts.readPartsPage(access, new URLSearchParams()));
  const review = await count(() => m.review.readReviewPage(access, ids.reviewId));
  return {
    board: { queries: board.queries, size: board.result.rows.length + board.result.spares.notReady.length },
    gearSet: { queries: gearSet.queries, size: gearSet.result!.inspections.length },
    inspection: { queries: inspection.queries, size: inspection.result!.change ? 1 : 0 },
    parts: { queries: parts.queries, size: parts.result.table.total },
    review: { queries: review.queries, size: review.result.review.comments.length },
  };
}

beforeAll(async () => {
  folder = mkdtempSync(join(tmpdir(), 'lashline-read-models-'));
  // Before the imports: the database module reads both once, and vitest gives each file its own modules.
  vi.stubEnv('DATABASE_URL', `file:${join(folder, 'season.db')}`);
  vi.stubEnv('LASHLINE_COUNT_QUERIES', '1');
  m = await load();
  const { db } = await m.client.openDatabase();
  await m.migrate.applyMigrations(db);
  const result = await m.demo.seedDemo();
  seeded = result.demo!;
  access = {
    user: {
      id: seeded.people.userIds['crew-chief'],
      email: 'chief@example.test',
      name: 'Chief',
      lengthUnit: 'in',
      torqueUnit: 'lbf-in',
      currentTeamId: seeded.people.teamId,
      secondFactor: false,
    },
    team: { id: seeded.people.teamId, name: 'Demo', role: 'crew-chief' },
  };
}, 120_000);

afterAll(() => {
  m?.client.closeDatabase();
  vi.unstubAllEnvs();
  rmSync(folder, { recursive: true, force: true });
});

describe('read models', () => {
  it('send as many queries with a season of data as with the demo, screen by screen', async () => {
    const demo = await measure('GS-4101');
    await m.season.seedSeason(seeded.people, seeded.register);
    const season = await measure(m.season.SEASON_BIG_SET);

    // The season really is bigger where each screen reads: otherwise flat counts would prove nothing.
    expect(season.gearSet!.size).toBe(m.season.SEASON.bigSetInspections);
    expect(demo.gearSet!.size).toBe(7);
    expect(season.parts!.size).toBeGreaterThan(demo.parts!.size + 99);
    expect(season.board!.size).toBeGreaterThan(demo.board!.size);
    expect(season.inspection!.size).toBe(1);
    expect(season.review!.size).toBe(2);

    const counts = (screens: Record<string, Screen>) =>
      Object.fromEntries(Object.entries(screens).map(([name, s]) => [name, s.queries]));
    expect(counts(season)).toEqual(counts(demo));
    // And few: a handful per screen, whatever the data.
    for (const [name, queries] of Object.entries(counts(demo))) expect(queries, name).toBeLessThanOrEqual(14);
  }, 120_000);
});

describe('the board at a season', () => {
  it('shows the most urgent first and the rest behind one link that counts them', async () => {
    const { boardRankOf } = await import('../../../src/lib/board/board');
    const shown = await m.board.readBoard(access, new URLSearchParams());
    const all = await m.board.readBoard(access, new URLSearchParams('all=1'));
    expect(all.spares.ready.length).toBeGreaterThan(m.board.BOARD_FIRST_SPARES);
    expect(shown.spares.ready).toEqual(all.spares.ready.slice(0, m.board.BOARD_FIRST_SPARES));
    expect(shown.spares.moreReady).toBe(all.spares.ready.length - m.board.BOARD_FIRST_SPARES);
    expect(shown.rows).toEqual(all.rows.slice(0, m.board.BOARD_FIRST_ROWS));
    expect(shown.showAllHref).toBe('/?all=1');
    expect(all.showAllHref).toBeNull();
    // Spares have their own list; the main one is in use, most urgent first.
    expect(all.rows.every((r) => r.status !== 'spare')).toBe(true);
    const ranks = all.rows.map(boardRankOf);
    expect([...ranks].sort((a, b) => b - a)).toEqual(ranks);
    const spares = await m.board.readBoard(access, new URLSearchParams('status=spare'));
    expect(spares.rows.length).toBe(m.board.BOARD_FIRST_ROWS);
    expect(spares.showAllHref).toBe('/?status=spare&all=1');
  });
});

describe('the board’s and the gear set page’s kept analyses', () => {
  it('follow the database: a row written straight into it (as another process would) shows on the next read', async () => {
    const before = await m.board.readBoard(access, new URLSearchParams('all=1'));
    const row = [...before.rows, ...before.spares.ready].find((r) => r.inspectionCount > 0)!;
    const pageBefore = await m.gearSet.readGearSet(access, row.id);
    const db = await m.client.getDb();
    const { inspections } = m.schema;
    const latest = (await db
      .select()
      .from(inspections)
      .where(eq(inspections.gearSetId, row.id))
      .orderBy(desc(inspections.inspectedAt))
      .get())!;
    const at = new Date(Date.parse(latest.inspectedAt.toISOString()) + 86_400_000);
    // No use-case, no hook into any cache: the kept analysis must notice from the rows alone.
    await m.client.write((tx) =>
      tx.insert(inspections).values({
        ...latest,
        id: `${latest.id}-again`,
        inspectedAt: at,
        submittedAt: at,
        updatedAt: at,
        idempotencyKey: null,
      }),
    );
    const after = await m.board.readBoard(access, new URLSearchParams('all=1'));
    const again = [...after.rows, ...after.spares.ready, ...after.spares.notReady.map((n) => ({ ...n, id: '' }))].find(
      (r) => 'inspectionCount' in r && r.id === row.id,
    ) as typeof row | undefined;
    expect(again?.inspectionCount).toBe(row.inspectionCount + 1);
    expect(again?.lastInspectedAt).toBe(at.toISOString());
    const pageAfter = await m.gearSet.readGearSet(access, row.id);
    expect(pageAfter!.inspections.length).toBe(pageBefore!.inspections.length + 1);
    expect(pageAfter!.analysis.latest?.inspectedAt).toBe(at.toISOString());
  });
});
