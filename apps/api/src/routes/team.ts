// The company's people: members and their roles, invitations by e-mail, and accepting one.
import { Router } from 'express';
import { acceptInvitationInput, invitationInput, memberRoleUpdate } from '@bumperline/contracts/team';
import { roleLabels } from '@bumperline/contracts/roles';
import { withScope, type Db, type Tx } from '@bumperline/db/client';
import {
  addMember,
  claimInvitation,
  countOwners,
  findInvitationByTokenHash,
  getMember,
  insertInvitation,
  listMembers,
  listOpenInvitations,
  removeMember,
  revokeInvitation,
  setMemberRole,
} from '@bumperline/db/queries/team';
import { findUserByEmail, insertUser, setActiveCompany, updateUser } from '@bumperline/db/queries/identity';
import { recordEmailProof } from '@bumperline/db/queries/email-proof';
import { recordAudit } from '@bumperline/db/queries/audit';
import { hashPassword } from '@bumperline/db/passwords';
import { ConflictError, HttpError, NotFoundError, ValidationError } from '../http/errors.ts';
import type { makeScoped } from '../http/guards.ts';
import { parse } from '../http/validate.ts';
import { idParam } from '../http/params.ts';
import { hashToken, newToken } from '../auth/tokens.ts';
import type { Mailer } from '../services/mailer.ts';
import { appLink } from '../services/links.ts';

const INVITE_TTL_MS = 7 * 24 * 3600_000;

export function teamRouter(deps: { scoped: ReturnType<typeof makeScoped>; mailer: Mailer; appOrigin: string }): Router {
  const { scoped, mailer, appOrigin } = deps;
  const r = Router();

  r.get(
    '/',
    scoped('team:read', async ({ tx }) => ({ members: await listMembers(tx), invitations: await listOpenInvitations(tx) })),
  );

  r.post(
    '/invitations',
    scoped(
      'team:manage',
      async ({ tx, req, actor, afterCommit }) => {
        const input = parse(invitationInput, req.body);
        const { token, hash } = newToken();
        const id = await insertInvitation(tx, {
          email: input.email,
          role: input.role,
          tokenHash: hash,
          invitedBy: actor.userId,
          expiresAt: new Date(Date.now() + INVITE_TTL_MS),
        });
        await recordAudit(tx, {
          actorUserId: actor.userId,
          action: 'invite',
          entity: 'invitation',
          entityId: id,
          after: { email: input.email, role: input.role },
        });
        const link = appLink(appOrigin, `/invitation?token=${token}`);
        afterCommit(() =>
          mailer.send({
            to: input.email,
            subject: `${actor.name} invited you to Bumperline`,
            text: `${actor.name} invited you to join their operator company on Bumperline as ${roleLabels[input.role].toLowerCase()}.\n\nAccept here (valid for 7 days):\n${link}`,
          }),
        );
        return { id, email: input.email, role: input.role };
      },
      201,
    ),
  );

  r.delete(
    '/invitations/:id',
    scoped('team:manage', async ({ tx, req, actor }) => {
      const id = idParam(req);
      if (!(await revokeInvitation(tx, id))) throw new NotFoundError('open invitation');
      await recordAudit(tx, { actorUserId: actor.userId, action: 'revoke', entity: 'invitation', entityId: id });
      return undefined;
    }),
  );

  r.patch(
    '/members/:id',
    scoped('team:manage', async ({ tx, req, actor }) => {
      const userId = idParam(req);
      const { role } = parse(memberRoleUpdate, req.body);
      const member = await getMember(tx, userId);
      if (!member) throw new NotFoundError('member');
      if (member.role === 'owner' && role !== 'owner' && (await countOwners(tx)) <= 1) {
        throw new ConflictError('A company needs at least one owner.');
      }
      await setMemberRole(tx, userId, role);
      await recordAudit(tx, {
        actorUserId: actor.userId,
        action: 'update',
        entity: 'member',
        entityId: userId,
        before: { role: member.role },
        after: { role },
      });
      return { userId, role };
    }),
  );

  r.delete(
    '/members/:id',
    scoped('team:manage', async ({ tx, req, actor }) => {
      const userId = idParam(req);
      const member = await getMember(tx, userId);
      if (!member) throw new NotFoundError('member');
      if (member.role === 'owner' && (await countOwners(tx)) <= 1) throw new ConflictError('A company needs at least one owner.');
      await removeMember(tx, userId);
      await recordAudit(tx, {
        actorUserId: actor.userId,
        action: 'remove',
        entity: 'member',
        entityId: userId,
        before: { role: member.role },
      });
      return undefined;
    }),
  );

  return r;
}

/** Public: what an invitation link is for, and accepting it. */
export function invitationsRouter(db: Db): Router {
  const r = Router();

  async function lookup(token: string) {
    const inv = await findInvitationByTokenHash(db, hashToken(token));
    if (!inv) throw new NotFoundError('invitation');
    if (inv.revokedAt)
      throw new HttpError(
        410,
        'Invitation withdrawn',
        'This invitation was withdrawn. Ask for a new one.',
        [{ field: 'token', message: 'was withdrawn' }],
        'gone',
      );
    if (inv.acceptedAt)
      throw new HttpError(
        410,
        'Invitation used',
        'This invitation was already accepted. Sign in instead.',
        [{ field: 'token', message: 'was already used' }],
        'gone',
      );
    if (inv.expiresAt < new Date())
      throw new HttpError(
        410,
        'Invitation expired',
        'This invitation has expired. Ask for a new one.',
        [{ field: 'token', message: 'has expired' }],
        'gone',
      );
    return inv;
  }

  // An account whose address nobody has confirmed does not count: the invitee holds a link mailed to the
  // address, which proves it, and takes that account over as if it were new (see email-proof.ts).
  const provenAccount = async (executor: Db | Tx, email: string) => {
    const user = await findUserByEmail(executor, email);
    return { user, proven: user?.emailVerifiedAt ? user : undefined };
  };

  r.get('/:token', async (req, res) => {
    const inv = await lookup(req.params.token);
    const { proven } = await provenAccount(db, inv.email);
    res.json({ companyName: inv.tenantName, email: inv.email, role: inv.role, hasAccount: !!proven });
  });

  r.post('/:token/accept', async (req, res) => {
    const inv = await lookup(req.params.token);
    const input = parse(acceptInvitationInput, req.body ?? {});
    // Hashed before the transaction, so it holds its connection only for the writes.
    const newPasswordHash = input.password ? await hashPassword(input.password) : null;
    const userId = await withScope(db, { tenantId: inv.tenantId }, async (tx) => {
      // First, so that of simultaneous accepts one goes on and the others stop here, having written nothing
      // (and before the account check below, which a winner that just committed would otherwise change).
      if (!(await claimInvitation(tx, inv.id))) {
        throw new HttpError(
          409,
          'Invitation already accepted',
          'This invitation has just been accepted. Sign in instead.',
          [{ field: 'token', message: 'was already used' }],
          'conflict',
        );
      }
      // Any refusal below rolls the claim back with the transaction.
      const { user, proven } = await provenAccount(tx, inv.email);
      if (proven) {
        // Joining with an existing account needs that account signed in.
        if (req.actor?.userId !== proven.id) {
          throw new HttpError(409, 'Sign in first', `Sign in as ${inv.email} to accept this invitation.`, undefined, 'sign-in-required');
        }
      } else {
        const errors = [];
        if (!input.name) errors.push({ field: 'name', message: 'is required' });
        if (!input.password) errors.push({ field: 'password', message: 'is required' });
        if (errors.length) throw new ValidationError(errors);
      }
      const passwordHash = proven ? null : newPasswordHash;
      let id: string;
      if (proven) id = proven.id;
      else if (user) {
        await recordEmailProof(tx, user.id, { keepPassword: false });
        await updateUser(tx, user.id, { name: input.name!, passwordHash });
        id = user.id;
      } else {
        id = await insertUser(tx, { email: inv.email, name: input.name!, passwordHash, emailVerifiedAt: new Date() });
      }
      await addMember(tx, id, inv.role);
      await recordAudit(tx, { actorUserId: id, action: 'join', entity: 'member', entityId: id, after: { role: inv.role } });
      return id;
    });
    if (req.actor?.userId === userId) await setActiveCompany(db, req.actor.sessionId, inv.tenantId);
    res.status(201).json({ companyId: inv.tenantId, role: inv.role, email: inv.email });
  });

  return r;
}
