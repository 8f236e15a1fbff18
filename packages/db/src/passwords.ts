// Password hashing with Argon2id (OWASP Password Storage Cheat Sheet's first choice).
import { randomBytes } from 'node:crypto';
import { hash, verify } from '@node-rs/argon2';

export function hashPassword(password: string): Promise<string> {
  return hash(password);
}

// Checked instead when there is no hash (no such account, or one without a password), so that a
// sign-in for an unknown address costs the same time as one for a known address. Made on first use,
// with the same parameters as real hashes, from a secret nobody holds.
let standIn: Promise<string> | undefined;
const standInHash = () => (standIn ??= hash(randomBytes(32).toString('base64url')));

export async function verifyPassword(passwordHash: string | null | undefined, password: string): Promise<boolean> {
  const checked = passwordHash ?? (await standInHash());
  try {
    return (await verify(checked, password)) && checked === passwordHash;
  } catch {
    return false;
  }
}
