/**
 * kill -9 a hundred times in the middle of writes (three clients logging runs, one uploading photos),
 * restarting on the same folder after each: prints how many writes were acknowledged and whether
 * every one survived, integrity_check, the migrations, photo rows without whole files, temporary
 * files left and served, and the restart times. tests/api/crash.test.ts is the five-kill version.
 *
 *   npm run build && npx tsx bench/crash-restart.ts [kills] [seed]
 *   (another build: LASHLINE_DIST=/tmp/mine/dist, its parent folder holding a node_modules link)
 */
import { performance } from 'node:perf_hooks';
import { signedInClient } from '../tests/helpers/api-client';
import { MIGRATION_FILES, assertPhotoColumns, checkAfterRestart, writeUntilKilled } from '../tests/helpers/crash';
import { noiseImage } from '../tests/helpers/images';
import { createInspection } from '../tests/helpers/inspections';
import { percentile } from '../tests/helpers/load';
import { startServer } from '../tests/helpers/server';
import { createRandom, pickInteger } from '../tests/helpers/seeded-random';

const kills = Number(process.argv[2] ?? 100);
const seed = Number(process.argv[3] ?? Date.now() % 100_000);
const random = createRandom(seed);
const server = await startServer();
const problems: string[] = [];
try {
  const { client } = await signedInClient(server.baseUrl, { team: 'Crash Bench Crew' });
  const carId = (await client.post('/api/cars', { name: 'Crash car' })).body.id as string;
  const gearSetId = (await client.post('/api/gear-sets', { serial: 'CRASH-B1', ringTeeth: 41, pinionTeeth: 10 })).body
    .id as string;
  const inspectionId = await createInspection(client, gearSetId);
  const photo = await noiseImage('jpeg', 800, 600);
  await assertPhotoColumns(server.databaseUrl);
  const target = { server, writers: [client, client, client], carId, uploader: client, inspectionId, photo };
  const runs = new Set<string>();
  const photos = new Set<string>();
  const restartMs: number[] = [];
  let cutOff = 0;
  let partialsSeen = 0;
  const started = performance.now();
  console.log(`${kills} kills, seed ${seed}, on ${server.dataDir} …`);
  for (let kill = 1; kill <= kills; kill += 1) {
    const killAfterMs = pickInteger(random, 100, 3000);
    const acknowledged = await writeUntilKilled(target, killAfterMs, `kill ${kill}`);
    acknowledged.runs.forEach((id) => runs.add(id));
    acknowledged.photos.forEach((id) => photos.add(id));
    cutOff += acknowledged.cutOff;
    const t0 = performance.now();
    await server.restart();
    restartMs.push(performance.now() - t0);
    const after = await checkAfterRestart(server, client, { runs, photos });
    partialsSeen = Math.max(partialsSeen, after.partialFiles.length);
    const where = `kill ${kill} (after ${killAfterMs} ms)`;
    if (acknowledged.unexpected.length)
      problems.push(`${where}: unexpected answers ${acknowledged.unexpected.slice(0, 3).join(' | ')}`);
    if (after.integrity !== 'ok') problems.push(`${where}: integrity_check ${after.integrity}`);
    if (after.migrationsApplied !== MIGRATION_FILES)
      problems.push(`${where}: ${after.migrationsApplied} of ${MIGRATION_FILES} migrations`);
    if (after.missingRuns.length) problems.push(`${where}: ${after.missingRuns.length} acknowledged runs missing`);
    if (after.missingPhotos.length)
      problems.push(`${where}: ${after.missingPhotos.length} acknowledged photos missing`);
    if (after.brokenPhotoRows.length)
      problems.push(`${where}: ${after.brokenPhotoRows.length} photo rows without whole files`);
    if (after.servedPartials.length)
      problems.push(`${where}: temporary files served ${after.servedPartials.join(', ')}`);
    if (kill % 10 === 0)
      console.log(
        `  ${kill} kills: ${runs.size} runs and ${photos.size} photos acknowledged so far, ${problems.length} problems`,
      );
  }
  console.log(`kills: ${kills} in ${((performance.now() - started) / 1000).toFixed(0)} s (seed ${seed})`);
  console.log(
    `acknowledged before a kill: ${runs.size} runs, ${photos.size} photos; requests cut off by a kill: ${cutOff}`,
  );
  console.log(
    `after every restart: integrity_check ok, ${MIGRATION_FILES} migrations, every acknowledged write present — ${problems.length ? 'NO' : 'yes'}`,
  );
  console.log(
    `temporary .partial files left in the photo folder (most at once): ${partialsSeen}; served: none unless listed below`,
  );
  console.log(
    `restart to healthy: p50 ${percentile(restartMs, 50).toFixed(0)} ms, p99 ${percentile(restartMs, 99).toFixed(0)} ms, max ${Math.max(...restartMs).toFixed(0)} ms`,
  );
  for (const problem of problems.slice(0, 20)) console.log(`  PROBLEM ${problem}`);
  console.log(problems.length ? `RESULT: ${problems.length} problems` : 'RESULT: no problems');
} finally {
  await server.stop();
}
process.exitCode = problems.length ? 1 : 0;
