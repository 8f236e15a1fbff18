// Unguessable one-time tokens for links (invitations): the raw token goes in the e-mail, only its SHA-256 is stored.
import { randomBytes } from 'node:crypto';
import { hashToken } from '@bumperline/db/queries/email-tokens';

export { hashToken };

export function newToken(): { token: string; hash: string } {
  const token = randomBytes(32).toString('base64url');
  return { token, hash: hashToken(token) };
}
