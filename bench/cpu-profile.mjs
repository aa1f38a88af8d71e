// Preload for a server under a benchmark: samples the CPU from start and writes a .cpuprofile into
// PROFILE_DIR on SIGTERM (node --cpu-prof is refused in NODE_OPTIONS). The main-thread inspector answers
// synchronously, so the file is written before any other SIGTERM handler can exit the process.
// Open it in Chrome DevTools → Performance.
//   NODE_OPTIONS=--import=./bench/cpu-profile.mjs PROFILE_DIR=/tmp/prof npx tsx scripts/serve.ts

import { writeFileSync } from 'node:fs';
import { Session } from 'node:inspector';
import { join } from 'node:path';

const folder = process.env.PROFILE_DIR ?? '.';
const session = new Session();
session.connect();
session.post('Profiler.enable');
session.post('Profiler.start');
process.prependOnceListener('SIGTERM', () => {
  session.post('Profiler.stop', (error, result) => {
    if (!error) writeFileSync(join(folder, `server-${process.pid}.cpuprofile`), JSON.stringify(result.profile));
  });
  if (process.listenerCount('SIGTERM') === 0) process.exit(0);
});
