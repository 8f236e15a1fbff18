// Sign-up (with the e-mail confirming its address), who am I, company switching, password reset and
// e-mailed sign-in links. Signing in and out themselves are Auth.js's (/auth/...).
// The forms anyone can use without signing in answer the same whether or not the address has an
// account, and their e-mails are capped per address (AccountMailLimiter).
import { randomUUID } from 'node:crypto';
import { Router } from 'express';
import {
  passwordResetConfirm,
  passwordResetRequest,
  signUpAnswer,
  signUpInput,
  switchCompanyInput,
  verifyEmailInput,
  type Me,
} from '@bumperline/contracts/auth';
import { withScope, type Db } from '@bumperline/db/client';
import { createCompany, getCompanySummary } from '@bumperline/db/queries/companies';
import {
  findUserByEmail,
  findUserById,
  insertUserIfNew,
  listCompaniesIn,
  listCompaniesOf,
  revokeAllSessionsOf,
  setActiveCompany,
  updateUser,
} from '@bumperline/db/queries/identity';
import { recordEmailProof } from '@bumperline/db/queries/email-proof';
import { hashPassword, verifyPassword } from '@bumperline/db/passwords';
import { ValidationError } from '../http/errors.ts';
import { requireActor } from '../http/guards.ts';
import { parse } from '../http/validate.ts';
import { consumeEmailToken, endEmailTokensOf, issueEmailToken, type EmailTokenPurpose } from '@bumperline/db/queries/email-tokens';
import type { Mail, Mailer } from '../services/mailer.ts';
import { confirmAddressMail, passwordResetMail, signInLinkMail, signUpWithTakenAddressMail } from '../services/account-mail.ts';
import type { SignInLimiter } from '../auth/sign-in-limiter.ts';
import type { AccountMailKind, AccountMailLimiter } from '../auth/account-mail-limiter.ts';

const RESET_TTL_MS = 60 * 60_000;
const LINK_TTL_MS = 20 * 60_000;
const CONFIRM_TTL_MS = 24 * 3600_000;
const sentIfKnown = { status: 'sent-if-known' } as const;

export function accountRouter(deps: {
  db: Db;
  mailer: Mailer;
  appOrigin: string;
  signInLimiter: SignInLimiter;
  mailLimiter: AccountMailLimiter;
}): Router {
  const { db, mailer, appOrigin, signInLimiter, mailLimiter } = deps;
  const r = Router();

  /**
   * Mails a one-time link to an address that has an account (and, with `unless`, is not in that state),
   * within the hourly cap. Its callers answer 202 either way, so the form reveals nothing.
   */
  async function mailLinkIfKnown(
    kind: AccountMailKind,
    email: string,
    link: {
      purpose: EmailTokenPurpose;
      ttlMs: number;
      mail: (to: string, origin: string, token: string) => Mail;
      unless?: (user: { emailVerifiedAt: Date | null }) => boolean;
    },
  ): Promise<void> {
    if (!(await mailLimiter.allow(kind, email))) return;
    const user = await findUserByEmail(db, email);
    if (!user || link.unless?.(user)) return;
    const token = await issueEmailToken(db, user.id, link.purpose, link.ttlMs);
    await mailer.send(link.mail(user.email, appOrigin, token));
  }

  // A new address gets its company and a confirmation link; an address that has an account gets a
  // notice instead. Both answer 202 "check your e-mail", after the same work (the hash included).
  r.post('/sign-up', async (req, res) => {
    const input = parse(signUpInput, req.body);
    const passwordHash = await hashPassword(input.password);
    const tenantId = randomUUID();
    const userId = await withScope(db, { tenantId }, async (tx) => {
      const ownerId = await insertUserIfNew(tx, { email: input.email, name: input.name, passwordHash });
      if (!ownerId) return undefined;
      await createCompany(tx, { id: tenantId, name: input.companyName, timeZone: input.timeZone, currency: input.currency, ownerId });
      return ownerId;
    });
    if (await mailLimiter.allow('sign-up', input.email)) {
      if (userId) {
        const token = await issueEmailToken(db, userId, 'verify-email', CONFIRM_TTL_MS);
        await mailer.send(confirmAddressMail(input.email, appOrigin, token));
      } else {
        await mailer.send(signUpWithTakenAddressMail(input.email, appOrigin));
      }
    }
    res.status(202).json(signUpAnswer);
  });

  // The link in the confirmation e-mail, opened with the sign-up's password: only then is that password kept.
  // A wrong password leaves the link unused (the transaction rolls back), and says so beside the field.
  r.post('/verify-email', async (req, res) => {
    const { token, password } = parse(verifyEmailInput, req.body);
    const email = await db.transaction(async (tx) => {
      const userId = await consumeEmailToken(tx, token, 'verify-email');
      if (!userId) return undefined;
      const user = await findUserById(tx, userId);
      if (!user || !(await verifyPassword(user.passwordHash, password))) {
        throw new ValidationError([{ field: 'password', message: 'is not the password chosen at sign-up' }]);
      }
      await recordEmailProof(tx, userId, { keepPassword: true });
      return user.email;
    });
    if (!email) throw new ValidationError([{ field: 'token', message: 'is invalid, used or expired: ask for a new link' }]);
    await signInLimiter.addressProven(email);
    res.status(204).end();
  });

  // Another confirmation link, for an address not yet confirmed. Always 202.
  r.post('/verify-email/resend', async (req, res) => {
    const { email } = parse(passwordResetRequest, req.body);
    await mailLinkIfKnown('sign-up', email, {
      purpose: 'verify-email',
      ttlMs: CONFIRM_TTL_MS,
      mail: confirmAddressMail,
      unless: (user) => !!user.emailVerifiedAt,
    });
    res.status(202).json(sentIfKnown);
  });

  r.get('/me', async (req, res) => {
    const actor = requireActor(req);
    // One transaction: the person's companies (their own memberships) and the active one's summary.
    const { companies, company } = await withScope(db, { tenantId: actor.tenantId, userId: actor.userId }, async (tx) => ({
      companies: await listCompaniesIn(tx, actor.userId),
      company: actor.tenantId ? ((await getCompanySummary(tx, actor.tenantId)) ?? null) : null,
    }));
    const me: Me = {
      user: { id: actor.userId, email: actor.email, name: actor.name },
      company,
      role: actor.role,
      companies,
      isPlatformAdmin: actor.isPlatformAdmin,
    };
    res.json(me);
  });

  r.post('/me/company', async (req, res) => {
    const actor = requireActor(req);
    const { tenantId } = parse(switchCompanyInput, req.body);
    const companies = await listCompaniesOf(db, actor.userId);
    if (!companies.some((c) => c.id === tenantId)) {
      throw new ValidationError([{ field: 'tenantId', message: 'is not a company you belong to' }]);
    }
    await setActiveCompany(db, actor.sessionId, tenantId);
    res.status(204).end();
  });

  // Always 202, whether or not the address has an account, so the form reveals nothing.
  r.post('/password-reset', async (req, res) => {
    const { email } = parse(passwordResetRequest, req.body);
    await mailLinkIfKnown('password-reset', email, { purpose: 'password-reset', ttlMs: RESET_TTL_MS, mail: passwordResetMail });
    res.status(202).json(sentIfKnown);
  });

  r.post('/password-reset/confirm', async (req, res) => {
    const { token, password } = parse(passwordResetConfirm, req.body);
    const passwordHash = await hashPassword(password);
    const user = await db.transaction(async (tx) => {
      const usedBy = await consumeEmailToken(tx, token, 'password-reset');
      if (!usedBy) return undefined;
      const u = await updateUser(tx, usedBy, { passwordHash });
      // The link proves the address; the password was chosen through it, so it is kept.
      await recordEmailProof(tx, usedBy, { keepPassword: true });
      // Whoever had an older link, or a session, had it under the old password: all of them end.
      await endEmailTokensOf(tx, usedBy);
      await revokeAllSessionsOf(tx, usedBy);
      return u;
    });
    if (!user) throw new ValidationError([{ field: 'token', message: 'is invalid, used or expired: ask for a new link' }]);
    await signInLimiter.addressProven(user.email);
    res.status(204).end();
  });

  // E-mailed sign-in link (venue contacts have no password; anyone whose password sign-in is paused). Also always 202.
  r.post('/sign-in-link', async (req, res) => {
    const { email } = parse(passwordResetRequest, req.body);
    await mailLinkIfKnown('sign-in-link', email, { purpose: 'sign-in', ttlMs: LINK_TTL_MS, mail: signInLinkMail });
    res.status(202).json(sentIfKnown);
  });

  return r;
}
