/**
 * JavaScript each page ships, gzipped, against its target: 80 KB on pages without charts (the board),
 * 120 KB on the procedure editor, reading view and checklist runner,
 * 220 KB on chart pages. Builds nothing: it starts the built server (dist/, or LASHLINE_DIST) with the
 * demo data, signs in as the demo crew chief, fetches each page, and follows every script it references
 * — <script src>, <link rel="modulepreload">, the islands' component-url and renderer-url, inline
 * scripts — and the static imports of those chunks, transitively. Chunks only a dynamic import()
 * loads (code that arrives when someone opens a form) are listed apart and not counted.
 *
 *   npx astro build && npx tsx bench/page-weight.ts
 *   LASHLINE_DIST=/tmp/other npx tsx bench/page-weight.ts
 */
import { gzipSync } from 'node:zlib';
import { ApiClient } from '../tests/helpers/api-client';
import { startServer } from '../tests/helpers/server';

const KB = 1024;
const TARGETS = { plain: 80 * KB, chart: 220 * KB, procedures: 120 * KB } as const;

interface PageWeight {
  name: string;
  path: string;
  target: number;
  files: { url: string; gzip: number }[];
  inline: number;
  lazy: string[];
}

const attr = (tag: string, name: string): string | null =>
  new RegExp(`\\b${name}\\s*=\\s*"([^"]*)"`, 'i').exec(tag)?.[1] ?? null;

/** Every script URL a page references, and the gzip size of its inline scripts. */
export function collectPageScripts(html: string): { urls: string[]; inline: string[] } {
  const urls = new Set<string>();
  const inline: string[] = [];
  for (const match of html.matchAll(/<script\b([^>]*)>([\s\S]*?)<\/script>/gi)) {
    const src = attr(match[0].slice(0, match[0].indexOf('>') + 1), 'src');
    const type = attr(`<x ${match[1]}>`, 'type');
    if (src) urls.add(src);
    else if (match[2]!.trim() && (!type || type === 'module' || type === 'text/javascript')) inline.push(match[2]!);
  }
  for (const match of html.matchAll(/<link\b[^>]*>/gi)) {
    if (/rel\s*=\s*"modulepreload"/i.test(match[0])) {
      const href = attr(match[0], 'href');
      if (href) urls.add(href);
    }
  }
  for (const match of html.matchAll(/<astro-island\b[^>]*>/gi)) {
    for (const name of ['component-url', 'renderer-url']) {
      const url = attr(match[0], name);
      if (url) urls.add(url.replace(/&amp;/g, '&'));
    }
  }
  return { urls: [...urls], inline };
}

/** Static imports (import … from "x", import "x", export … from "x") and dynamic ones, relative to `url`. */
export function findImports(code: string, url: string): { static: string[]; dynamic: string[] } {
  const resolve = (spec: string) => new URL(spec, url).toString();
  const local = (spec: string) => spec.startsWith('.') || spec.startsWith('/');
  const statics = new Set<string>();
  const dynamics = new Set<string>();
  for (const m of code.matchAll(/\b(?:import|export)\s*(?:[\w*{}\s,$]+\s*from\s*)?["']([^"']+)["']/g))
    if (local(m[1]!)) statics.add(resolve(m[1]!));
  for (const m of code.matchAll(/\bimport\(\s*["']([^"']+)["']\s*\)/g)) if (local(m[1]!)) dynamics.add(resolve(m[1]!));
  return { static: [...statics], dynamic: [...dynamics].filter((u) => !statics.has(u)) };
}

async function weighPage(
  client: ApiClient,
  baseUrl: string,
  name: string,
  path: string,
  target: number,
): Promise<PageWeight> {
  const response = await client.request(path);
  if (response.status !== 200) throw new Error(`${path} answered ${response.status}`);
  const html = await response.text();
  const { urls, inline } = collectPageScripts(html);
  const queue = urls.map((u) => new URL(u, baseUrl).toString());
  const seen = new Map<string, number>();
  const lazy = new Set<string>();
  while (queue.length) {
    const url = queue.shift()!;
    if (seen.has(url)) continue;
    const code = await (await client.request(new URL(url).pathname + new URL(url).search)).text();
    seen.set(url, gzipSync(code).length);
    const imports = findImports(code, url);
    queue.push(...imports.static);
    for (const d of imports.dynamic) lazy.add(d);
  }
  for (const url of seen.keys()) lazy.delete(url);
  return {
    name,
    path,
    target,
    files: [...seen].map(([url, gzip]) => ({ url: new URL(url).pathname, gzip })).sort((a, b) => b.gzip - a.gzip),
    inline: inline.reduce((sum, code) => sum + gzipSync(code).length, 0),
    lazy: [...lazy].map((u) => new URL(u).pathname),
  };
}

/** The demo's first procedure in the editor and the reading view, and its checklist in progress. */
async function procedurePages(client: ApiClient): Promise<[string, string, number][]> {
  const procedure = (await client.get<{ items: { id: string }[] }>('/api/procedures')).body.items[0];
  const checklist = (await client.get<{ items: { id: string }[] }>('/api/checklists?status=in-progress')).body.items[0];
  if (!procedure || !checklist) throw new Error('The demo has no procedure or no checklist in progress.');
  return [
    ['procedure editor', `/procedures/${procedure.id}/edit`, TARGETS.procedures],
    ['procedure', `/procedures/${procedure.id}`, TARGETS.procedures],
    ['checklist', `/checklists/${checklist.id}`, TARGETS.procedures],
  ];
}

async function main(): Promise<void> {
  const server = await startServer({ demo: true });
  try {
    const client = new ApiClient(server.baseUrl);
    await client.signIn('chief@lashline.test', 'lashline-demo');
    const sets = (await client.get<{ items: { id: string; serial: string }[] }>('/api/gear-sets')).body.items;
    const set = sets.find((s) => s.serial === 'GS-4101') ?? sets[0];
    if (!set) throw new Error('The demo has no gear set.');
    const inspections = (
      await client.get<{ items: { id: string }[] }>(`/api/inspections?gearSetId=${set.id}&status=submitted`)
    ).body.items;
    const latest = inspections.at(-1);
    const pages: [string, string, number][] = [
      ['board', '/', TARGETS.plain],
      [`gear set ${set.serial}`, `/gear-sets/${set.id}`, TARGETS.chart],
      ...(latest ? ([['inspection', `/inspections/${latest.id}`, TARGETS.chart]] as [string, string, number][]) : []),
      ['compare', `/gear-sets/${set.id}/compare`, TARGETS.chart],
      ['parts', '/parts', TARGETS.plain],
      [`part ${set.serial}`, `/parts/${set.id}`, TARGETS.plain],
      ['cars', '/cars', TARGETS.plain],
      ['runs', '/runs', TARGETS.plain],
      ['reviews', '/reviews', TARGETS.plain],
      // The sheet draws a polar chart of the readings as they are typed.
      ['inspection sheet', `/inspections/new?gearSetId=${set.id}`, TARGETS.chart],
      // Procedures (issue 18): the editor, the reading view and the checklist runner, each at most 120 KB.
      ...(await procedurePages(client)),
    ];
    let over = 0;
    console.log('JavaScript shipped per page (gzip)\n');
    for (const [name, path, target] of pages) {
      const page = await weighPage(client, server.baseUrl, name, path, target);
      const total = page.files.reduce((sum, f) => sum + f.gzip, 0) + page.inline;
      const ok = total <= target;
      if (!ok) over += 1;
      console.log(
        `${ok ? 'ok  ' : 'OVER'} ${name.padEnd(16)} ${(total / KB).toFixed(1).padStart(6)} KB of ${target / KB} KB   ${path}`,
      );
      for (const f of page.files) console.log(`       ${(f.gzip / KB).toFixed(1).padStart(6)} KB  ${f.url}`);
      if (page.inline) console.log(`       ${(page.inline / KB).toFixed(1).padStart(6)} KB  inline scripts`);
      if (page.lazy.length) console.log(`       not counted, loaded on demand: ${page.lazy.join(', ')}`);
    }
    if (over) process.exitCode = 1;
  } finally {
    await server.stop();
  }
}

await main();
