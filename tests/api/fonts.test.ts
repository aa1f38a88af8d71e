import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startServer, type RunningServer } from '../helpers/server';

/**
 * The font ships with the app (no other host), the page preloads the very file its stylesheet names, and
 * the stylesheet asks for `font-display: optional`, so a late font never re-flows a page (styles/fonts.css).
 */
let server: RunningServer;
beforeAll(async () => {
  server = await startServer();
});
afterAll(() => server?.stop());

describe('the shipped font', () => {
  it('is preloaded from this server, named by the stylesheet, and never swapped in late', async () => {
    const html = await (await fetch(`${server.baseUrl}/sign-in`)).text();
    const preload = /<link rel="preload" href="([^"]+\.woff2)" as="font" type="font\/woff2" crossorigin>/.exec(
      html,
    )?.[1];
    const stylesheet = /<link rel="stylesheet" href="([^"]+\.css)">/.exec(html)?.[1];
    expect(preload).toMatch(/^\/_astro\/roboto-flex-latin-wght-normal\.[\w-]+\.woff2$/);
    expect(stylesheet).toMatch(/^\/_astro\//);

    const css = await (await fetch(`${server.baseUrl}${stylesheet}`)).text();
    const faces = [...css.matchAll(/@font-face\s*\{([^}]*)\}/g)].map((m) => m[1]!);
    const latin = faces.find((face) => face.includes(`url(${preload})`));
    expect(latin).toBeDefined();
    expect(latin).toMatch(/font-display:\s*optional/);
    expect(faces.filter((face) => /font-display:\s*swap/.test(face))).toEqual([]);

    const font = await fetch(`${server.baseUrl}${preload}`);
    expect(font.status).toBe(200);
    expect(font.headers.get('content-type')).toBe('font/woff2');
    expect(font.headers.get('cache-control')).toContain('immutable');
    expect((await font.arrayBuffer()).byteLength).toBeGreaterThan(10_000);
  });
});
