/// <reference types="astro/client" />

declare namespace App {
  interface Locals {
    /** The signed-in person (`loadSession` in lib/server/session.ts); null when signed out. */
    user: import('./lib/server/accounts').PublicUser | null;
    /** The person's current team and their role in it (`loadSession`). */
    team: { id: string; name: string; role: import('./lib/roles').Role; secondFactorMissing?: boolean } | null;
    /** Why a page guard refused this request; set only while the refusal page renders. */
    refusal?: string;
  }
}

// auth-astro's virtual module with the project's auth.config.ts (declared here rather than through
// auth-astro's module.d.ts, whose sources do not pass strict type-checking).
declare module 'auth:config' {
  const config: import('auth-astro/src/config').FullAuthConfig;
  export default config;
}
