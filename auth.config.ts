import { CredentialsSignin } from '@auth/core/errors';
import Credentials from '@auth/core/providers/credentials';
import type { FullAuthConfig } from 'auth-astro/src/config';
import { signInSchema } from './src/lib/account-schemas';
import { verifyCredentials } from './src/lib/server/accounts';
import { resolveAuthSecret } from './src/lib/server/auth-secret';
import { recordSignInOutcome } from './src/lib/server/sign-in-limiter';
import { logSecurityEvent } from './src/lib/server/security-log';
import { checkSecondFactor } from './src/lib/server/second-factor';

/** The password was right and a second factor is on: the sign-in page asks for the code. */
class SecondFactorNeeded extends CredentialsSignin {
  code = 'second-factor';
}

// auth-astro reads import.meta.env, fixed at build time; the secret and host trust are given here
// so they are read when the server starts.
// Written out rather than through auth-astro's defineConfig (which only sets prefix and basePath),
// so type-checking does not pull in the integration's own sources.
const config: FullAuthConfig = {
  prefix: '/api/auth',
  basePath: '/api/auth',
  secret: resolveAuthSecret(),
  trustHost: true,
  session: { strategy: 'jwt', maxAge: 14 * 24 * 60 * 60 },
  pages: { signIn: '/sign-in', error: '/sign-in' },
  logger: {
    // A wrong password is an ordinary event, logged as such by security-log; not a stack trace.
    error(error) {
      if (error.name !== 'CredentialsSignin') console.error(error);
    },
  },
  providers: [
    Credentials({
      credentials: {
        email: { label: 'E-mail' },
        password: { label: 'Password', type: 'password' },
        code: { label: 'Code' },
      },
      async authorize(raw) {
        const parsed = signInSchema.safeParse(raw);
        if (!parsed.success) return null;
        const { email, password } = parsed.data;
        const user = await verifyCredentials(email, password);
        if (user?.totpEnabledAt) {
          const code = typeof raw.code === 'string' ? raw.code.trim() : '';
          const passed = code !== '' && (await checkSecondFactor(user, code));
          if (!passed) {
            recordSignInOutcome(email, false);
            logSecurityEvent('sign-in-failed', {
              email,
              userId: user.id,
              reason: code ? 'wrong second-factor code' : 'second-factor code needed',
            });
            throw new SecondFactorNeeded();
          }
        }
        recordSignInOutcome(email, Boolean(user));
        logSecurityEvent(user ? 'sign-in' : 'sign-in-failed', { email, userId: user?.id });
        if (!user) return null;
        return { id: user.id, email: user.email, name: user.name, sessionVersion: user.sessionVersion };
      },
    }),
  ],
  callbacks: {
    jwt({ token, user }) {
      if (user) {
        token.sub = user.id;
        token.sv = (user as { sessionVersion?: number }).sessionVersion;
      }
      return token;
    },
    session({ session, token }) {
      if (token.sub) session.user.id = token.sub;
      return session;
    },
  },
};

export default config;
