import body from '../../components/shared/offline-shell-worker.js?raw';

/** Which pages a service worker keeps for opening offline, and what it says for one never opened here. */
export interface OfflineShell {
  /** Names its cache, `lashline-<name>-v1`; an older version of that cache is dropped. */
  name: string;
  pages: RegExp;
  /** The answer, offline, for a page of the shell not opened on this device before. */
  missing: string;
}

/**
 * A service worker for `shell`, served from a route rather than public/ so that it carries a policy
 * letting it fetch from Lashline itself (static files get `default-src 'none'`, which would stop its
 * every fetch), and so that its scope is its route's folder. One worker text for every shell; the
 * settings are written before it.
 */
export function offlineShellWorker(shell: OfflineShell): Response {
  const settings = `const SHELL = { cache: ${JSON.stringify(`lashline-${shell.name}-v1`)}, prefix: ${JSON.stringify(
    `lashline-${shell.name}-`,
  )}, pages: new RegExp(${JSON.stringify(shell.pages.source)}), missing: ${JSON.stringify(shell.missing)} };\n`;
  return new Response(settings + body, {
    headers: {
      'Content-Type': 'text/javascript; charset=utf-8',
      'Content-Security-Policy': "default-src 'self'; frame-ancestors 'none'",
      'Cache-Control': 'no-cache',
    },
  });
}
