/**
 * Each role's first screen in Chromium, cold (a fresh browser context, so an empty cache, each time):
 * compressed JavaScript and CSS bytes, request count and Largest Contentful Paint, median of 3 loads.
 * Printed beside the targets, never asserted. Needs the built web app (`npx vite build`).
 *   npx tsx tests/bench/first-screen.bench.ts
 * Targets: first-screen JS ≤ 150 KB compressed for Today, ≤ 220 KB for the map screen (Calls);
 * LCP < 1.0 s on localhost for Today and the technician's home.
 */
import { existsSync } from 'node:fs';
import path from 'node:path';
import { chromium, type Browser, type BrowserContext } from '@playwright/test';
import { repoRoot, startDemoServer } from '../support/demo-server.ts';
import { demo, DEMO_PASSWORD } from '../e2e/fixtures.ts';

const LOADS = 3;
const KB = 1000;

interface Screen {
  role: keyof typeof signIns;
  screen: string;
  path: string;
  /** Text the screen shows once its code has rendered; each load then waits for the network to go quiet. */
  ready: string;
  jsTargetKb?: number;
  lcpTargetMs?: number;
}

const screens: Screen[] = [
  { role: 'owner', screen: 'Today', path: '/today', ready: 'Down now', jsTargetKb: 150, lcpTargetMs: 1000 },
  { role: 'owner', screen: 'Calls (map)', path: '/calls', ready: 'Every open service call', jsTargetKb: 220 },
  { role: 'dispatcher', screen: 'Today', path: '/today', ready: 'Down now', jsTargetKb: 150, lcpTargetMs: 1000 },
  { role: 'dispatcher', screen: 'Calls (map)', path: '/calls', ready: 'Every open service call', jsTargetKb: 220 },
  { role: 'technician', screen: 'home (My day)', path: '/my-day', ready: 'Stops in driving order', jsTargetKb: 150, lcpTargetMs: 1000 },
  { role: 'venue contact', screen: 'venue view', path: '/today', ready: 'Your games at' },
];

/** Auth.js's own endpoints, as the sign-in page calls them (answers JSON with X-Auth-Return-Redirect). */
async function authPost(ctx: BrowserContext, baseUrl: string, action: string, fields: Record<string, string>) {
  const { csrfToken } = (await (await ctx.request.get(`${baseUrl}/auth/csrf`)).json()) as { csrfToken: string };
  const res = await ctx.request.post(`${baseUrl}/auth/callback/${action}`, {
    form: { ...fields, csrfToken },
    headers: { 'X-Auth-Return-Redirect': '1' },
  });
  const { url } = (await res.json()) as { url: string };
  if (new URL(url).searchParams.has('error')) throw new Error(`sign-in (${action}) refused: ${url}`);
}

function password(email: string) {
  return (ctx: BrowserContext, baseUrl: string) => authPost(ctx, baseUrl, 'credentials', { email, password: DEMO_PASSWORD });
}

/** Venue contacts sign in by an e-mailed link: ask for one, read it from the mail fake, use its token. */
function emailedLink(email: string) {
  return async (ctx: BrowserContext, baseUrl: string) => {
    const asked = await ctx.request.post(`${baseUrl}/api/account/sign-in-link`, {
      data: { email },
      headers: { 'X-Requested-With': 'bumperline', Origin: baseUrl },
    });
    if (!asked.ok()) throw new Error(`sign-in link refused: ${asked.status()}`);
    let token: string | null = null;
    for (let i = 0; i < 50 && !token; i++) {
      const outbox = (await (await ctx.request.get(`${baseUrl}/dev/outbox.json`)).json()) as { messages: { to: string[]; text: string }[] };
      const mail = outbox.messages.findLast((m) => m.to.includes(email) && /\/sign-in\/link\?/.test(m.text));
      token = mail ? new URL(/https?:\/\/\S+/.exec(mail.text)![0]).searchParams.get('token') : null;
      if (!token) await new Promise((r) => setTimeout(r, 100));
    }
    if (!token) throw new Error('no sign-in link arrived in the mail fake');
    await authPost(ctx, baseUrl, 'email-link', { token });
  };
}

const signIns = {
  owner: password(demo.owner),
  dispatcher: password(demo.dispatcher),
  technician: password(demo.technician),
  'venue contact': emailedLink(demo.venueContact),
};

interface Load {
  jsBytes: number;
  cssBytes: number;
  fontBytes: number;
  requests: number;
  apiRequests: string[];
  lcpMs: number;
}

async function coldLoad(browser: Browser, baseUrl: string, cookies: Awaited<ReturnType<BrowserContext['cookies']>>, screen: Screen) {
  const ctx = await browser.newContext({ viewport: { width: 1280, height: 800 } });
  try {
    await ctx.addCookies(cookies);
    const page = await ctx.newPage();
    // Registered before any script of the page runs, so the first LCP entries are kept (buffered anyway).
    await page.addInitScript(`window.__lcp = 0;
      new PerformanceObserver((list) => {
        for (const e of list.getEntries()) window.__lcp = e.startTime;
      }).observe({ type: 'largest-contentful-paint', buffered: true });`);
    const apiRequests: string[] = [];
    page.on('request', (r) => {
      const u = new URL(r.url());
      if (u.pathname.startsWith('/api/')) apiRequests.push(`${r.method()} ${u.pathname}${u.search}`);
    });
    await page.goto(`${baseUrl}${screen.path}`);
    await page.getByText(screen.ready).first().waitFor({ timeout: 30_000 });
    await page.waitForLoadState('networkidle');
    const figures = (await page.evaluate(measureInPage)) as Omit<Load, 'apiRequests'>;
    return { ...figures, apiRequests };
  } finally {
    await ctx.close();
  }
}

// Run in the page as a string: tsx's helpers (e.g. __name) do not exist there.
const measureInPage = `(() => {
  const entries = performance.getEntriesByType('resource');
  const sum = (test) => entries.filter((e) => test.test(new URL(e.name).pathname)).reduce((t, e) => t + e.encodedBodySize, 0);
  return {
    jsBytes: sum(/\\.m?js$/),
    cssBytes: sum(/\\.css$/),
    fontBytes: sum(/\\.woff2?$/),
    requests: entries.length + performance.getEntriesByType('navigation').length,
    lcpMs: window.__lcp,
  };
})()`;

const median = (values: number[]) => [...values].sort((a, b) => a - b)[Math.floor(values.length / 2)] ?? NaN;
const kb = (bytes: number) => `${(bytes / KB).toFixed(1)} kB`;

if (!existsSync(path.join(repoRoot, 'dist/web/index.html'))) {
  console.log('first-screen: skipped — build the web app first (npx vite build).');
} else {
  const server = await startDemoServer();
  const browser = await chromium.launch({
    executablePath: process.env.CHROMIUM_PATH ?? '/usr/bin/chromium',
    headless: true,
    args: [
      '--no-sandbox',
      '--disable-gpu',
      '--disable-background-networking',
      '--disable-component-update',
      '--disable-sync',
      '--no-first-run',
    ],
  });
  try {
    const rows: Record<string, string | number>[] = [];
    const signedIn = new Map<Screen['role'], Awaited<ReturnType<BrowserContext['cookies']>>>();
    for (const screen of screens) {
      // Sign in once per person (a venue contact's link mails are limited per hour); each load gets the cookie only.
      if (!signedIn.has(screen.role)) {
        const ctx = await browser.newContext();
        await signIns[screen.role](ctx, server.baseUrl);
        signedIn.set(screen.role, await ctx.cookies());
        await ctx.close();
      }
      const loads: Load[] = [];
      for (let i = 0; i < LOADS; i++) loads.push(await coldLoad(browser, server.baseUrl, signedIn.get(screen.role)!, screen));
      const jsBytes = median(loads.map((l) => l.jsBytes));
      const lcpMs = median(loads.map((l) => l.lcpMs));
      const calls = loads[0]!.apiRequests.filter((r) => r.startsWith('GET /api/calls?')).length;
      rows.push({
        role: screen.role,
        screen: screen.screen,
        js: kb(jsBytes),
        js_target: screen.jsTargetKb ? `≤ ${screen.jsTargetKb} kB ${jsBytes <= screen.jsTargetKb * KB ? 'met' : 'MISSED'}` : '—',
        css: kb(median(loads.map((l) => l.cssBytes))),
        fonts: kb(median(loads.map((l) => l.fontBytes))),
        requests: median(loads.map((l) => l.requests)),
        api_requests: median(loads.map((l) => l.apiRequests.length)),
        calls_list_requests: calls,
        lcp: `${lcpMs.toFixed(0)} ms`,
        lcp_target: screen.lcpTargetMs ? `< ${screen.lcpTargetMs} ms ${lcpMs < screen.lcpTargetMs ? 'met' : 'MISSED'}` : '—',
      });
    }
    console.log(`\nFirst screen per role, cold cache, compressed bytes sent, median of ${LOADS} loads (Chromium, localhost)`);
    console.table(rows);
  } finally {
    await browser.close();
    await server.stop();
  }
}
