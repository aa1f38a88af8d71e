// Throughput of POST /api/analysis/backlash on the built server, against a bare node:http baseline doing the
// same work (read the body, JSON.parse, the same zod schema, analyseBacklash, JSON answer), both measured the
// same way: keep-alive, 20 connections, a fixed time, loopback only. Issue 4's targets: ≥ 1,000 req/s at 20
// connections and ≥ a quarter of the baseline.
//
//   npm run build && node --import tsx bench/analysis-throughput.mjs
//
// Another build (its folder's parent needs node_modules, or the build cannot resolve its packages):
//   mkdir -p /tmp/mine && ln -sfn "$PWD/node_modules" /tmp/mine/node_modules
//   npx astro build --outDir /tmp/mine/dist && LASHLINE_DIST=/tmp/mine/dist node --import tsx bench/analysis-throughput.mjs
//
// The served path is the fast lane (src/fast-lane.ts); the same request through Astro's whole pipeline
// (LASHLINE_FAST_LANE=off) is measured too, for comparison only.
//
// BENCH_SECONDS (default 10) and BENCH_CONNECTIONS (default 20) change the run; BENCH_CPU_PROF=folder writes a
// CPU profile of the server there (bench/cpu-profile.mjs). The baseline runs in a child process (this file
// with --baseline), like the real server, so neither shares an event loop with the load generator.
// --import tsx: the baseline and the helpers that start the real server are TypeScript.

import { execFileSync, spawn } from 'node:child_process';
import { readFileSync } from 'node:fs';
import http from 'node:http';
import { performance } from 'node:perf_hooks';

const SECONDS = Number(process.env.BENCH_SECONDS ?? 10);
const CONNECTIONS = Number(process.env.BENCH_CONNECTIONS ?? 20);
const WARM_UP_SECONDS = 2;
const REQUEST_TIMEOUT_MS = 5_000;
const PATH = '/api/analysis/backlash';
// Eight readings 45° apart (GM 2005's eight points), a GM 1996 band and a 41:10 set: a realistic request.
const BODY = JSON.stringify({
  unit: 'mm',
  readings: [0.18, 0.17, 0.15, 0.14, 0.15, 0.16, 0.18, 0.19],
  profile: { min: 0.13, max: 0.23, maxSpread: 0.05 },
  ringTeeth: 41,
  pinionTeeth: 10,
});

/** The bare server: what an endpoint costs without Astro, middleware, session or database. */
async function serveBaseline() {
  const { analyseBacklash, backlashRequestSchema } = await import('../src/lib/analysis/index.ts');
  const server = http.createServer((request, response) => {
    const chunks = [];
    let size = 0;
    request.on('data', (chunk) => {
      size += chunk.length;
      if (size <= 64 * 1024) chunks.push(chunk);
    });
    request.on('end', () => {
      let status = 200;
      let answer;
      try {
        if (size > 64 * 1024) throw Object.assign(new Error('too large'), { status: 413 });
        const parsed = backlashRequestSchema.safeParse(JSON.parse(Buffer.concat(chunks).toString('utf8')));
        if (!parsed.success) throw Object.assign(new Error('invalid'), { status: 400 });
        answer = analyseBacklash(parsed.data);
      } catch (error) {
        status = error.status ?? 400;
        answer = { error: { message: error.message } };
      }
      response.writeHead(status, { 'Content-Type': 'application/json; charset=utf-8', 'Cache-Control': 'no-store' });
      response.end(JSON.stringify(answer));
    });
  });
  server.listen(0, '127.0.0.1', () => process.send?.({ port: server.address().port }));
  process.on('disconnect', () => process.exit(0));
}

function startBaseline() {
  const child = spawn(process.execPath, ['--import', 'tsx', import.meta.filename, '--baseline'], {
    stdio: ['ignore', 'inherit', 'inherit', 'ipc'],
  });
  return new Promise((resolve, reject) => {
    const timer = setTimeout(() => reject(new Error('baseline did not start within 20 s')), 20_000);
    child.once('exit', (code) => reject(new Error(`baseline exited with ${code}`)));
    child.once('message', ({ port }) => {
      clearTimeout(timer);
      resolve({ baseUrl: `http://127.0.0.1:${port}`, pid: child.pid, stop: () => child.kill('SIGTERM') });
    });
  });
}

// Server CPU time per answer, read from /proc (Linux): unlike req/s it hardly moves when other work shares
// the machine, so two runs on a busy box can still be compared.
const CLOCK_TICKS = (() => {
  try {
    return Number(execFileSync('getconf', ['CLK_TCK']).toString()) || 100;
  } catch {
    return 100;
  }
})();

function readCpuSeconds(pid) {
  try {
    const fields = readFileSync(`/proc/${pid}/stat`, 'utf8').split(') ')[1].split(' ');
    return (Number(fields[11]) + Number(fields[12])) / CLOCK_TICKS;
  } catch {
    return NaN;
  }
}

/** One POST; resolves with its status and latency in ms (status 0 for a transport error or a timeout). */
function post(agent, baseUrl, headers) {
  return new Promise((resolve) => {
    const started = performance.now();
    const request = http.request(`${baseUrl}${PATH}`, { method: 'POST', agent, headers }, (response) => {
      response.resume();
      response.on('end', () => resolve({ status: response.statusCode, ms: performance.now() - started }));
    });
    request.setTimeout(REQUEST_TIMEOUT_MS, () => request.destroy(new Error('timeout')));
    request.on('error', () => resolve({ status: 0, ms: performance.now() - started }));
    request.end(BODY);
  });
}

/** `connections` loops, each sending the next request when the last answered, for `seconds`. */
async function load(baseUrl, extraHeaders, seconds) {
  if (!/^http:\/\/127\.0\.0\.1:/.test(baseUrl)) throw new Error(`loopback only, not ${baseUrl}`);
  const agent = new http.Agent({ keepAlive: true, maxSockets: CONNECTIONS });
  const headers = {
    'content-type': 'application/json',
    'content-length': String(Buffer.byteLength(BODY)),
    origin: baseUrl,
    ...extraHeaders,
  };
  const latencies = [];
  let failed = 0;
  const started = performance.now();
  const deadline = started + seconds * 1000;
  const loop = async () => {
    while (performance.now() < deadline) {
      const { status, ms } = await post(agent, baseUrl, headers);
      if (status === 200) latencies.push(ms);
      else failed++;
    }
  };
  await Promise.all(Array.from({ length: CONNECTIONS }, loop));
  const elapsed = (performance.now() - started) / 1000;
  agent.destroy();
  latencies.sort((a, b) => a - b);
  const at = (share) => latencies[Math.min(latencies.length - 1, Math.floor(share * latencies.length))] ?? NaN;
  return { rps: latencies.length / elapsed, p50: at(0.5), p99: at(0.99), ok: latencies.length, failed };
}

/** Checks the answer once, so a fast run of 401s or 400s cannot pass for throughput. */
async function checkAnswer(baseUrl, extraHeaders, lane) {
  const response = await fetch(`${baseUrl}${PATH}`, {
    method: 'POST',
    headers: { 'content-type': 'application/json', origin: baseUrl, ...extraHeaders },
    body: BODY,
  });
  const body = await response.json();
  if (response.status !== 200 || body.count !== 8 || !body.runoutEstimate) {
    throw new Error(`${baseUrl}${PATH} answered ${response.status} ${JSON.stringify(body)}`);
  }
  if (lane !== undefined && response.headers.get('server-timing') !== lane) {
    throw new Error(
      `${baseUrl}${PATH} was not answered by the expected path (Server-Timing: ${response.headers.get('server-timing')})`,
    );
  }
}

async function measure(label, baseUrl, extraHeaders, pid, lane) {
  await checkAnswer(baseUrl, extraHeaders, lane);
  await load(baseUrl, extraHeaders, WARM_UP_SECONDS);
  const cpuBefore = readCpuSeconds(pid);
  const result = await load(baseUrl, extraHeaders, SECONDS);
  result.cpuMs = ((readCpuSeconds(pid) - cpuBefore) * 1000) / (result.ok + result.failed);
  const fixed = (n) => n.toFixed(2).padStart(7);
  console.log(
    `${label.padEnd(22)} ${result.rps.toFixed(0).padStart(6)} req/s   p50 ${fixed(result.p50)} ms   p99 ${fixed(result.p99)} ms   ` +
      `server CPU ${result.cpuMs.toFixed(3)} ms/req   (${result.ok} ok, ${result.failed} failed)`,
  );
  return result;
}

/** BENCH_CPU_PROF=folder: the server writes a .cpuprofile there when it stops (see cpu-profile.mjs). */
function profileEnv() {
  const folder = process.env.BENCH_CPU_PROF;
  if (!folder) return {};
  return { NODE_OPTIONS: `--import=${new URL('./cpu-profile.mjs', import.meta.url).href}`, PROFILE_DIR: folder };
}

async function main() {
  const { startServer, SERVER_ENTRY } = await import('../tests/helpers/server.ts');
  const { signedInClient } = await import('../tests/helpers/api-client.ts');
  console.log(`POST ${PATH}, ${CONNECTIONS} connections, ${SECONDS} s each after ${WARM_UP_SECONDS} s warm-up`);
  console.log(`server: ${SERVER_ENTRY}`);
  const server = await startServer({ env: profileEnv() });
  const baseline = await startBaseline();
  const throughAstro = await startServer({ env: { LASHLINE_FAST_LANE: 'off' } });
  try {
    const signIn = async (running) => ({
      cookie: (await signedInClient(running.baseUrl, { team: 'Bench Team' })).client.cookieHeader(),
    });
    const lashline = await measure(
      'Lashline (signed in)',
      server.baseUrl,
      await signIn(server),
      server.pid(),
      'fast-lane',
    );
    const bare = await measure('bare node:http', baseline.baseUrl, {}, baseline.pid);
    const astro = await measure(
      'via Astro, for contrast',
      throughAstro.baseUrl,
      await signIn(throughAstro),
      throughAstro.pid(),
      null,
    );
    const ratio = lashline.rps / bare.rps;
    console.log(`ratio Lashline / bare: ${ratio.toFixed(3)} (target ≥ 0.25)`);
    const cpuRatio = bare.cpuMs / lashline.cpuMs;
    console.log(
      `ratio by server CPU per request, bare / Lashline: ${cpuRatio.toFixed(3)} (steadier on a shared machine)`,
    );
    console.log(
      `the same request through Astro's pipeline (LASHLINE_FAST_LANE=off): ${(astro.rps / bare.rps).toFixed(3)} of bare by req/s, ` +
        `${(bare.cpuMs / astro.cpuMs).toFixed(3)} by CPU`,
    );
    console.log(
      `target ≥ 1000 req/s: ${lashline.rps >= 1000 ? 'met' : 'MISSED'}; target ≥ 1/4 of bare: ${ratio >= 0.25 ? 'met' : 'MISSED'}`,
    );
  } finally {
    baseline.stop();
    await Promise.all([server.stop(), throughAstro.stop()]);
  }
}

if (process.argv.includes('--baseline')) await serveBaseline();
else await main();
