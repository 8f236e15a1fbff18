// The company's people: members and their roles, invitations by e-mail, and accepting one from its link.
import { z } from 'zod';
import { isoDateTime, requiredText, uuid } from './common.ts';
import { email, password } from './auth.ts';
import { roles } from './roles.ts';

export const invitationInput = z.strictObject({ email, role: z.enum(roles) });
export type InvitationInput = z.input<typeof invitationInput>;
/** Name and password are needed only by someone without a confirmed account (the route says which). */
export const acceptInvitationInput = z.strictObject({
  name: requiredText(120).optional(),
  password: password.optional(),
});
export const memberRoleUpdate = z.strictObject({ role: z.enum(roles) });

export const member = z.strictObject({ userId: uuid, name: z.string(), email: z.string(), role: z.enum(roles), since: isoDateTime });
export type Member = z.infer<typeof member>;
export const openInvitation = z.strictObject({
  id: uuid,
  email: z.string(),
  role: z.enum(roles),
  expiresAt: isoDateTime,
  createdAt: isoDateTime,
});
export type OpenInvitation = z.infer<typeof openInvitation>;
export const team = z.strictObject({ members: z.array(member), invitations: z.array(openInvitation) });
export type Team = z.infer<typeof team>;

export const invitationSent = z.strictObject({ id: uuid, email: z.string(), role: z.enum(roles) });
export type InvitationSent = z.infer<typeof invitationSent>;
export const memberRoleChanged = z.strictObject({ userId: uuid, role: z.enum(roles) });
export type MemberRoleChanged = z.infer<typeof memberRoleChanged>;

/** What an invitation link is for (no sign-in): `hasAccount` when the address already has a confirmed account. */
export const invitationInfo = z.strictObject({ companyName: z.string(), email: z.string(), role: z.enum(roles), hasAccount: z.boolean() });
export type InvitationInfo = z.infer<typeof invitationInfo>;
export const invitationAccepted = z.strictObject({ companyId: uuid, role: z.enum(roles), email: z.string() });
export type InvitationAccepted = z.infer<typeof invitationAccepted>;
