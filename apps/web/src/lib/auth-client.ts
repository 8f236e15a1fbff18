// Signing in and out goes through Auth.js's own endpoints (/auth/...), which want its CSRF token.
import { signInRefusals, type SignInRefusal } from '@bumperline/contracts/sign-in-refusals';

async function csrfToken(): Promise<string> {
  const res = await fetch('/auth/csrf', { credentials: 'same-origin' });
  const body = (await res.json()) as { csrfToken: string };
  return body.csrfToken;
}

/** Auth.js answers 200 with a url either way; a failed sign-in's url carries ?error= and maybe &code=. */
async function authPost(path: string, fields: Record<string, string>): Promise<{ ok: boolean; code: string | null }> {
  const form = new URLSearchParams({ ...fields, csrfToken: await csrfToken() });
  const res = await fetch(path, {
    method: 'POST',
    credentials: 'same-origin',
    headers: { 'Content-Type': 'application/x-www-form-urlencoded', 'X-Auth-Return-Redirect': '1' },
    body: form,
  });
  if (!res.ok) return { ok: false, code: null };
  const body = (await res.json().catch(() => ({}))) as { url?: string };
  const url = new URL(body.url ?? '', window.location.origin);
  return url.searchParams.has('error') ? { ok: false, code: url.searchParams.get('code') } : { ok: true, code: null };
}

/** 'ok', 'wrong' (e-mail and password do not match), or why the API refused (see signInRefusals). */
export type PasswordSignInResult = 'ok' | 'wrong' | SignInRefusal;

export async function signInWithPassword(email: string, password: string): Promise<PasswordSignInResult> {
  const { ok, code } = await authPost('/auth/callback/credentials', { email, password });
  if (ok) return 'ok';
  return signInRefusals.find((r) => r === code) ?? 'wrong';
}

export async function signInWithLink(token: string): Promise<boolean> {
  return (await authPost('/auth/callback/email-link', { token })).ok;
}

export async function signOut(): Promise<boolean> {
  return (await authPost('/auth/signout', {})).ok;
}
