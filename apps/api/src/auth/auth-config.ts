// Auth.js for Express. Credentials sign-in needs JWT sessions, so the token carries only the id of a
// row in user_sessions; each request loads that row (and the person's memberships) from the database,
// which is what makes sign-out and removal from a company take effect at once.
import type { ExpressAuthConfig } from '@auth/express';
import Credentials from '@auth/express/providers/credentials';
import type { Db } from '@bumperline/db/client';
import { createSession, findUserById, revokeSession } from '@bumperline/db/queries/identity';
import { consumeEmailToken } from '@bumperline/db/queries/email-tokens';
import { recordEmailProof } from '@bumperline/db/queries/email-proof';
import type { SignInLimiter } from './sign-in-limiter.ts';
import { passwordSignIn } from './password-sign-in.ts';

export function buildAuthConfig(opts: { db: Db; secret: string; secureCookies: boolean; limiter: SignInLimiter }): ExpressAuthConfig {
  const { db, limiter } = opts;
  return {
    secret: opts.secret,
    trustHost: true,
    basePath: '/auth',
    useSecureCookies: opts.secureCookies,
    session: { strategy: 'jwt', maxAge: 30 * 24 * 3600 },
    pages: { signIn: '/sign-in', error: '/sign-in' },
    logger: { error: () => {}, warn: () => {}, debug: () => {} },
    providers: [
      Credentials({
        id: 'credentials',
        credentials: { email: {}, password: {} },
        authorize(raw, request) {
          return passwordSignIn(
            { db, limiter },
            {
              email: typeof raw.email === 'string' ? raw.email.trim().toLowerCase() : '',
              password: typeof raw.password === 'string' ? raw.password : '',
              ip: request.headers.get('x-bumperline-client-ip') ?? 'unknown',
            },
          );
        },
      }),
      // A one-time link e-mailed to the person (venue contacts always sign in so; anyone else may, and
      // must while their password sign-in is paused); the link page posts its token here.
      Credentials({
        id: 'email-link',
        credentials: { token: {} },
        async authorize(raw) {
          const token = typeof raw.token === 'string' ? raw.token : '';
          if (token.length < 20) return null;
          const user = await db.transaction(async (tx) => {
            const userId = await consumeEmailToken(tx, token, 'sign-in');
            if (!userId) return undefined;
            // The first proof of the address drops a password chosen before it (see email-proof.ts).
            await recordEmailProof(tx, userId, { keepPassword: false });
            return findUserById(tx, userId);
          });
          if (!user) return null;
          await limiter.addressProven(user.email);
          return { id: user.id, email: user.email, name: user.name };
        },
      }),
    ],
    callbacks: {
      async jwt({ token, user }) {
        if (user?.id) {
          token.sub = user.id;
          token.sid = await createSession(db, user.id);
        }
        return token;
      },
      async session({ session, token }) {
        return { ...session, sid: token.sid, userId: token.sub } as typeof session;
      },
    },
    events: {
      async signOut(message) {
        const sid = 'token' in message ? message.token?.sid : undefined;
        if (typeof sid === 'string') await revokeSession(db, sid);
      },
    },
  };
}
