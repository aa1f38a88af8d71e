import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { ApiClient } from '../helpers/api-client';
import { startServer, type RunningServer } from '../helpers/server';

/**
 * Every character the chart pages put on screen is one the preloaded font file has. A character outside
 * its unicode-range (an arrow, a ≈, a ✓) makes the browser search the system's fonts for it while it lays
 * the page out: on a cold tablet that search is the slowest step of the first paint. Shapes are drawn in
 * SVG or CSS instead (styles/global.css, `.back-link`).
 */
let server: RunningServer;
let viewer: ApiClient;
beforeAll(async () => {
  server = await startServer({ demo: true });
  viewer = new ApiClient(server.baseUrl);
  await viewer.signIn('viewer@lashline.test', 'lashline-demo');
});
afterAll(() => server?.stop());

/** The unicode-range of the @font-face whose file the page preloads, as [from, to] code points. */
async function preloadedRanges(html: string): Promise<[number, number][]> {
  const preload = /<link rel="preload" href="([^"]+\.woff2)" as="font"/.exec(html)![1]!;
  const stylesheet = /<link rel="stylesheet" href="([^"]+\.css)">/.exec(html)![1]!;
  const css = await (await fetch(`${server.baseUrl}${stylesheet}`)).text();
  const face = [...css.matchAll(/@font-face\s*\{([^}]*)\}/g)]
    .map((m) => m[1]!)
    .find((f) => f.includes(`url(${preload})`))!;
  const range = /unicode-range:\s*([^;}]+)/.exec(face)![1]!;
  return range.split(',').map((part) => {
    const [from, to] = part.trim().replace(/^U\+/i, '').split('-');
    // "U+??" covers 00–FF: a question mark stands for any hex digit.
    const low = parseInt(from!.replace(/\?/g, '0'), 16);
    const high = to ? parseInt(to, 16) : parseInt(from!.replace(/\?/g, 'F'), 16);
    return [low, high];
  });
}

/** The text a reader sees: scripts, styles and every tag (with its attributes) taken out, entities decoded. */
function visibleText(html: string): string {
  return html
    .replace(/<(script|style)\b[\s\S]*?<\/\1>/g, ' ')
    .replace(/<[^>"']*(?:"[^"]*"[^>"']*|'[^']*'[^>"']*)*>/g, ' ')
    .replace(/&#(\d+);/g, (_, n: string) => String.fromCodePoint(Number(n)))
    .replace(/&#x([\da-f]+);/gi, (_, n: string) => String.fromCodePoint(parseInt(n, 16)));
}

describe('the characters on the chart pages', () => {
  it('are all in the preloaded font file, so laying a page out never searches the system fonts', async () => {
    const sets = await viewer.get<{ items: { id: string; serial: string }[] }>('/api/gear-sets');
    const setId = sets.body.items.find((s) => s.serial === 'GS-4101')!.id;
    const inspections = await viewer.get<{ items: { id: string }[] }>(`/api/inspections?gearSetId=${setId}`);
    const paths = [
      '/',
      `/gear-sets/${setId}`,
      `/inspections/${inspections.body.items.at(-1)!.id}`,
      `/gear-sets/${setId}/compare`,
      '/parts',
      '/reviews',
    ];
    let ranges: [number, number][] | null = null;
    const strays: Record<string, string[]> = {};
    for (const path of paths) {
      const response = await fetch(`${server.baseUrl}${path}`, { headers: { cookie: viewer.cookieHeader() } });
      expect(response.status, path).toBe(200);
      const html = await response.text();
      ranges ??= await preloadedRanges(html);
      const text = visibleText(html);
      expect(text.length, path).toBeGreaterThan(200);
      const outside = [...new Set(text)].filter(
        (ch) => !ranges!.some(([low, high]) => ch.codePointAt(0)! >= low && ch.codePointAt(0)! <= high),
      );
      if (outside.length)
        strays[path] = outside.map((ch) => `${ch} U+${ch.codePointAt(0)!.toString(16).toUpperCase()}`);
    }
    expect(ranges!.length).toBeGreaterThan(5);
    expect(strays).toEqual({});
  });
});
