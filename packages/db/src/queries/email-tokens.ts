// One-time e-mailed tokens (password resets, sign-in links, sign-up confirmations): only the SHA-256 of
// a token is stored, and a token is used up by the first request that presents it in time.
import { createHash, randomBytes } from 'node:crypto';
import { and, eq, gt, isNull } from 'drizzle-orm';
import type { Db, Tx } from '../client.ts';
import { emailTokens } from '../schema/index.ts';

export type EmailTokenPurpose = (typeof emailTokens.$inferInsert)['purpose'];

export function hashToken(token: string): string {
  return createHash('sha256').update(token).digest('hex');
}

/** Creates a token for the person; returns the raw token, which only the e-mail will carry. */
export async function issueEmailToken(db: Db | Tx, userId: string, purpose: EmailTokenPurpose, ttlMs: number): Promise<string> {
  const token = randomBytes(32).toString('base64url');
  await db.insert(emailTokens).values({ tokenHash: hashToken(token), purpose, userId, expiresAt: new Date(Date.now() + ttlMs) });
  return token;
}

/** Uses the token up; the person it was for, or undefined when it is unknown, used or expired. */
export async function consumeEmailToken(db: Db | Tx, token: string, purpose: EmailTokenPurpose): Promise<string | undefined> {
  const [used] = await db
    .update(emailTokens)
    .set({ usedAt: new Date() })
    .where(
      and(
        eq(emailTokens.tokenHash, hashToken(token)),
        eq(emailTokens.purpose, purpose),
        isNull(emailTokens.usedAt),
        gt(emailTokens.expiresAt, new Date()),
      ),
    )
    .returning({ userId: emailTokens.userId });
  return used?.userId;
}

/** Uses up every token still open for the person (after a password reset, no older link may work). */
export async function endEmailTokensOf(db: Db | Tx, userId: string): Promise<void> {
  await db
    .update(emailTokens)
    .set({ usedAt: new Date() })
    .where(and(eq(emailTokens.userId, userId), isNull(emailTokens.usedAt)));
}
