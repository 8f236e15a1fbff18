// Signing in and out goes through Auth.js's own endpoints (/auth/...), which want its CSRF token.
async function csrfToken(): Promise<string> {
  const res = await fetch('/auth/csrf', { credentials: 'same-origin' });
  const body = (await res.json()) as { csrfToken: string };
  return body.csrfToken;
}

async function authPost(path: string, fields: Record<string, string>): Promise<boolean> {
  const form = new URLSearchParams({ ...fields, csrfToken: await csrfToken() });
  const res = await fetch(path, {
    method: 'POST',
    credentials: 'same-origin',
    headers: { 'Content-Type': 'application/x-www-form-urlencoded', 'X-Auth-Return-Redirect': '1' },
    body: form,
  });
  if (!res.ok) return false;
  const body = (await res.json().catch(() => ({}))) as { url?: string };
  return !String(body.url ?? '').includes('error=');
}

export function signInWithPassword(email: string, password: string): Promise<boolean> {
  return authPost('/auth/callback/credentials', { email, password });
}

export function signInWithLink(token: string): Promise<boolean> {
  return authPost('/auth/callback/email-link', { token });
}

export function signOut(): Promise<boolean> {
  return authPost('/auth/signout', {});
}
