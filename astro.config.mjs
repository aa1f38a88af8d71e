import { fileURLToPath } from 'node:url';
import { defineConfig } from 'astro/config';
import node from '@astrojs/node';
import react from '@astrojs/react';
import tailwindcss from '@tailwindcss/vite';
import auth from 'auth-astro';
import { CSP_DIRECTIVES } from './src/lib/security-headers.mjs';

// Astro builds request URLs from the Host header only for hosts listed here; without them every
// URL reads http://localhost and the origin check refuses each form post. ALLOWED_HOSTS adds more
// (comma-separated host names, for example a tablet reaching this machine by its LAN address).
const extraHosts = (process.env.ALLOWED_HOSTS ?? '')
  .split(',')
  .map((host) => host.trim())
  .filter(Boolean);

/**
 * Builds src/fast-lane.ts as a second server entry, dist/server/fast-lane.mjs, beside Astro's own: one
 * build, so the two share every module (one database connection, one set of caches). scripts/serve.mjs
 * offers each request to it first (docs/decisions/007-calculations-beside-astro.md).
 */
const fastLaneEntry = {
  name: 'lashline-fast-lane',
  hooks: {
    'astro:build:setup': ({ vite, target }) => {
      if (target !== 'server') return;
      const options = ((vite.build ??= {}).rollupOptions ??= {});
      options.input = [...[options.input ?? []].flat(), fileURLToPath(new URL('./src/fast-lane.ts', import.meta.url))];
    },
  },
};

export default defineConfig({
  output: 'server',
  // Middleware mode: scripts/serve.mjs wraps the handler with the security headers and the static files.
  adapter: node({ mode: 'middleware' }),
  integrations: [react(), auth(), fastLaneEntry],
  server: { host: process.env.HOST ?? 'localhost', port: Number(process.env.PORT ?? 4321) },
  security: {
    checkOrigin: true,
    allowedDomains: ['localhost', '127.0.0.1', ...extraHosts].map((hostname) => ({ hostname })),
  },
  experimental: {
    csp: {
      algorithm: 'SHA-256',
      directives: [...CSP_DIRECTIVES],
    },
  },
  vite: { plugins: [tailwindcss()] },
});
