// Sign-up, who am I, company switching, password reset and e-mailed sign-in links.
// Signing in and out themselves are Auth.js's (/auth/...).
import { randomUUID } from 'node:crypto';
import { Router } from 'express';
import { eq } from 'drizzle-orm';
import { passwordResetConfirm, passwordResetRequest, signUpInput, switchCompanyInput, type Me } from '@bumperline/contracts/auth';
import { withScope, type Db } from '@bumperline/db/client';
import { memberships, tenants, users } from '@bumperline/db/schema/index';
import { findUserByEmail, listCompaniesOf, revokeAllSessionsOf, setActiveCompany } from '@bumperline/db/queries/identity';
import { hashPassword } from '@bumperline/db/passwords';
import { ValidationError } from '../http/errors.ts';
import { requireActor } from '../http/guards.ts';
import { parse } from '../http/validate.ts';
import { consumeEmailToken, issueEmailToken } from '@bumperline/db/queries/email-tokens';
import type { Mailer } from '../services/mailer.ts';
import { appLink } from '../services/links.ts';

const RESET_TTL_MS = 60 * 60_000;
const LINK_TTL_MS = 20 * 60_000;

export function accountRouter(deps: { db: Db; mailer: Mailer; appOrigin: string }): Router {
  const { db, mailer, appOrigin } = deps;
  const r = Router();

  r.post('/sign-up', async (req, res) => {
    const input = parse(signUpInput, req.body);
    if (await findUserByEmail(db, input.email)) {
      throw new ValidationError([{ field: 'email', message: 'already has an account: sign in instead' }]);
    }
    const tenantId = randomUUID();
    const passwordHash = await hashPassword(input.password);
    const userId = await withScope(db, { tenantId }, async (tx) => {
      const [user] = await tx.insert(users).values({ email: input.email, name: input.name, passwordHash }).returning();
      await tx.insert(tenants).values({ id: tenantId, name: input.companyName, timeZone: input.timeZone, currency: input.currency });
      await tx.insert(memberships).values({ tenantId, userId: user!.id, role: 'owner' });
      return user!.id;
    });
    res.status(201).json({ userId, companyId: tenantId });
  });

  r.get('/me', async (req, res) => {
    const actor = requireActor(req);
    const companies = await listCompaniesOf(db, actor.userId);
    const company = actor.tenantId
      ? await withScope(db, { tenantId: actor.tenantId, userId: actor.userId }, async (tx) => {
          const [t] = await tx
            .select({ id: tenants.id, name: tenants.name, timeZone: tenants.timeZone, currency: tenants.currency, locale: tenants.locale })
            .from(tenants)
            .where(eq(tenants.id, actor.tenantId!));
          return t ?? null;
        })
      : null;
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
    const user = await findUserByEmail(db, email);
    if (user) {
      const token = await issueEmailToken(db, user.id, 'password-reset', RESET_TTL_MS);
      const link = appLink(appOrigin, `/reset-password?token=${token}`);
      await mailer.send({
        to: user.email,
        subject: 'Reset your Bumperline password',
        text: `Someone asked to reset the password for ${user.email}.\n\nChoose a new password here (valid for one hour):\n${link}\n\nIf it was not you, ignore this message.`,
      });
    }
    res.status(202).json({ status: 'sent-if-known' });
  });

  r.post('/password-reset/confirm', async (req, res) => {
    const { token, password } = parse(passwordResetConfirm, req.body);
    const passwordHash = await hashPassword(password);
    const userId = await db.transaction(async (tx) => {
      const usedBy = await consumeEmailToken(tx, token, 'password-reset');
      if (!usedBy) return undefined;
      await tx.update(users).set({ passwordHash }).where(eq(users.id, usedBy));
      return usedBy;
    });
    if (!userId) throw new ValidationError([{ field: 'token', message: 'is invalid, used or expired: ask for a new link' }]);
    // A new password signs the person out everywhere.
    await revokeAllSessionsOf(db, userId);
    res.status(204).end();
  });

  // E-mailed sign-in link (venue contacts have no password). Also always 202.
  r.post('/sign-in-link', async (req, res) => {
    const { email } = parse(passwordResetRequest, req.body);
    const user = await findUserByEmail(db, email);
    if (user) {
      const token = await issueEmailToken(db, user.id, 'sign-in', LINK_TTL_MS);
      const link = appLink(appOrigin, `/sign-in/link?token=${token}`);
      await mailer.send({
        to: user.email,
        subject: 'Your Bumperline sign-in link',
        text: `Open this link to sign in to Bumperline (valid for 20 minutes, once):\n${link}\n\nIf you did not ask for it, ignore this message.`,
      });
    }
    res.status(202).json({ status: 'sent-if-known' });
  });

  return r;
}
