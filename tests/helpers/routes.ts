import { readdirSync, readFileSync, statSync } from 'node:fs';
import { join, relative, sep } from 'node:path';
import { PROJECT_ROOT } from './server';

/**
 * The routes as the files under src/pages declare them, so that tests built on this list (the
 * access matrix, the fuzzer, the security headers) notice a new route without anyone telling them.
 */

export const HTTP_METHODS = ['GET', 'POST', 'PUT', 'PATCH', 'DELETE'] as const;
export type HttpMethod = (typeof HTTP_METHODS)[number];

export interface RouteFile {
  /** The URL pattern with Astro's brackets kept, e.g. `/api/inspections/[id]/photos`. */
  pattern: string;
  /** The file, relative to the project. */
  file: string;
  methods: HttpMethod[];
}

const PAGES = join(PROJECT_ROOT, 'src', 'pages');

function walk(folder: string): string[] {
  return readdirSync(folder).flatMap((name) => {
    const path = join(folder, name);
    return statSync(path).isDirectory() ? walk(path) : [path];
  });
}

/** `src/pages/api/runs/index.ts` → `/api/runs`; `[id].csv.ts` → `[id].csv`. */
export function fileToPattern(path: string): string {
  const route = relative(PAGES, path)
    .split(sep)
    .join('/')
    .replace(/\.(ts|js|astro)$/, '');
  const pattern = `/${route}`.replace(/\/index$/, '');
  return pattern === '' ? '/' : pattern;
}

/** The HTTP methods a route file exports: `export const GET = …` and `export const { GET, POST } = …`. */
export function exportedMethods(source: string): HttpMethod[] {
  const found = new Set<string>();
  for (const match of source.matchAll(
    /export\s+(?:const|let|async\s+function|function)\s+(GET|POST|PUT|PATCH|DELETE|ALL)\b/g,
  ))
    found.add(match[1]!);
  for (const match of source.matchAll(/export\s+const\s*\{([^}]*)\}/g)) {
    for (const name of match[1]!.split(',').map((part) => part.split(':')[0]!.trim())) found.add(name);
  }
  if (found.has('ALL'))
    throw new Error('A route exports ALL: list its methods one by one so the tests can check each.');
  return HTTP_METHODS.filter((method) => found.has(method));
}

/** Every endpoint file under src/pages/api, with its methods, sorted by pattern. */
export function listApiRoutes(): RouteFile[] {
  return walk(join(PAGES, 'api'))
    .filter((path) => /\.(ts|js)$/.test(path))
    .map((path) => ({
      pattern: fileToPattern(path),
      file: relative(PROJECT_ROOT, path),
      methods: exportedMethods(readFileSync(path, 'utf8')),
    }))
    .sort((a, b) => a.pattern.localeCompare(b.pattern));
}

/** Every `.astro` page under src/pages (the endpoints outside /api are listed by listOtherEndpoints). */
export function listPageRoutes(): RouteFile[] {
  return walk(PAGES)
    .filter((path) => path.endsWith('.astro'))
    .map((path) => ({ pattern: fileToPattern(path), file: relative(PROJECT_ROOT, path), methods: ['GET' as const] }))
    .sort((a, b) => a.pattern.localeCompare(b.pattern));
}

/** Endpoint files outside /api (e.g. the form target /teams/switch). */
export function listOtherEndpoints(): RouteFile[] {
  return walk(PAGES)
    .filter((path) => /\.(ts|js)$/.test(path) && !relative(PAGES, path).startsWith(`api${sep}`))
    .map((path) => ({
      pattern: fileToPattern(path),
      file: relative(PROJECT_ROOT, path),
      methods: exportedMethods(readFileSync(path, 'utf8')),
    }))
    .sort((a, b) => a.pattern.localeCompare(b.pattern));
}

/** `METHOD /pattern` keys of every API method, the way the access matrix names its rows. */
export function listApiEndpoints(): string[] {
  return listApiRoutes().flatMap((route) => route.methods.map((method) => `${method} ${route.pattern}`));
}

/** The bracketed parameters of a pattern, e.g. `['id', 'photoId']`. */
export function patternParams(pattern: string): string[] {
  return [...pattern.matchAll(/\[([^\]]+)\]/g)].map((match) => match[1]!);
}

/** Fills `[name]` in a pattern from `values` (URL-encoded). */
export function fillPattern(pattern: string, values: Record<string, string>): string {
  return pattern.replace(/\[([^\]]+)\]/g, (_, name: string) => {
    const value = values[name];
    if (value === undefined) throw new Error(`no value for [${name}] in ${pattern}`);
    return encodeURIComponent(value);
  });
}
