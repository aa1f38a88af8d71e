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

export default defineConfig({
  output: 'server',
  // Middleware mode: scripts/serve.mjs wraps the handler with the security headers and the static files.
  adapter: node({ mode: 'middleware' }),
  integrations: [react(), auth()],
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
