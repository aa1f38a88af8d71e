/// <reference types="astro/client" />

declare namespace App {
  interface Locals {
    /** The signed-in person, read from the database on this request; null when signed out. */
    user: import('./lib/server/accounts').PublicUser | null;
    /** The person's current team and their role in it, read fresh on this request. */
    team: { id: string; name: string; role: import('./lib/roles').Role; secondFactorMissing?: boolean } | null;
  }
}

// auth-astro's virtual module with the project's auth.config.ts (declared here rather than through
// auth-astro's module.d.ts, whose sources do not pass strict type-checking).
declare module 'auth:config' {
  const config: import('auth-astro/src/config').FullAuthConfig;
  export default config;
}
