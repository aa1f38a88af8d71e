import Credentials from '@auth/core/providers/credentials';
import type { FullAuthConfig } from 'auth-astro/src/config';
import { signInSchema } from './src/lib/account-schemas';
import { verifyCredentials } from './src/lib/server/accounts';
import { resolveAuthSecret } from './src/lib/server/auth-secret';
import { currentSignInAttempt } from './src/lib/server/sign-in-limiter';
import { logSecurityEvent } from './src/lib/server/security-log';
import { checkSecondFactor } from './src/lib/server/second-factor';
import { endSession, SESSION_MAX_AGE_SECONDS, startSession } from './src/lib/server/sessions';

// auth-astro reads import.meta.env, fixed at build time; the secret and host trust are given here
// so they are read when the server starts.
// Written out rather than through auth-astro's defineConfig (which only sets prefix and basePath),
// so type-checking does not pull in the integration's own sources.
const config: FullAuthConfig = {
  prefix: '/api/auth',
  basePath: '/api/auth',
  secret: resolveAuthSecret(),
  trustHost: true,
  session: { strategy: 'jwt', maxAge: SESSION_MAX_AGE_SECONDS },
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
      // Every failure gets the same answer (Auth.js's CredentialsSignin, ?error=… on the sign-in page):
      // an unknown e-mail, a wrong password, and a right password with a missing or wrong code alike.
      async authorize(raw) {
        const attempt = currentSignInAttempt();
        const parsed = signInSchema.safeParse(raw);
        // The middleware counted the attempt against the e-mail it read; anything else is refused.
        if (!parsed.success) {
          logSecurityEvent('sign-in-failed', { email: attempt?.email, reason: 'e-mail or password missing' });
          return null;
        }
        if (!attempt || parsed.data.email !== attempt.email) {
          logSecurityEvent('sign-in-failed', { email: parsed.data.email, reason: 'not counted by the limiter' });
          return null;
        }
        const { email, password } = parsed.data;
        const user = await verifyCredentials(email, password);
        if (!user) {
          logSecurityEvent('sign-in-failed', { email });
          return null;
        }
        if (user.totpEnabledAt) {
          const code = typeof raw.code === 'string' ? raw.code.trim() : '';
          if (!(code !== '' && (await checkSecondFactor(user, code)))) {
            if (code) await attempt.wrongCode();
            logSecurityEvent('sign-in-failed', {
              email,
              userId: user.id,
              reason: code ? 'wrong second-factor code' : 'second-factor code needed',
            });
            return null;
          }
        }
        await attempt.succeeded();
        logSecurityEvent('sign-in', { email, userId: user.id });
        return { id: user.id, email: user.email, name: user.name, sessionVersion: user.sessionVersion };
      },
    }),
  ],
  events: {
    // Sign-out ends this device's session on the server, so a copy of the cookie stops working too.
    async signOut(message) {
      const token = 'token' in message ? message.token : null;
      if (typeof token?.sid === 'string') await endSession(token.sid);
      logSecurityEvent('sign-out', { userId: token?.sub });
    },
  },
  callbacks: {
    async jwt({ token, user }) {
      if (user?.id) {
        token.sub = user.id;
        token.sv = (user as { sessionVersion?: number }).sessionVersion;
        // This device's session: the row sign-out deletes and the idle timeout reads.
        token.sid = await startSession(user.id);
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
