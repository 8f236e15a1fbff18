// Password sign-in over HTTP through Auth.js's own endpoints, as the web app does; returns the cookies.
function cookiesOf(res: Response): string[] {
  return res.headers.getSetCookie().map((c) => c.split(';')[0]!);
}

export async function signInCookie(base: string, email: string, password: string): Promise<string> {
  const csrf = await fetch(`${base}/auth/csrf`);
  const { csrfToken } = (await csrf.json()) as { csrfToken: string };
  const jar = cookiesOf(csrf);
  const res = await fetch(`${base}/auth/callback/credentials`, {
    method: 'POST',
    redirect: 'manual',
    headers: { 'content-type': 'application/x-www-form-urlencoded', 'x-auth-return-redirect': '1', cookie: jar.join('; ') },
    body: new URLSearchParams({ csrfToken, email, password }),
  });
  const body = (await res.json()) as { url?: string };
  const cookies = [...jar, ...cookiesOf(res)];
  if (res.status !== 200 || new URL(body.url ?? '', base).searchParams.has('error') || !cookies.some((c) => c.includes('session-token'))) {
    throw new Error(`sign-in failed for ${email}: ${res.status} ${body.url ?? ''}`);
  }
  return cookies.join('; ');
}
