// The whole service-call story in Chromium: a bartender reports a dead game from its game tag (once with
// JavaScript off, once on) → the dispatcher sees it on the map and in the table and assigns the suggested
// technician → the technician accepts by SMS reply on the phone fake → works it to fixed and closes it →
// the venue contact sees it closed, and the game's downtime is recorded.
import { expect, test, type APIRequestContext, type Browser, type Page } from '@playwright/test';
import { demo, scan, signIn } from './fixtures.ts';

const techPhones: Record<string, string> = {
  'Ilse Brandvold': '+13125550111',
  'Kofi Ansah-Whitfield': '+13125550112',
  'Parveen Lutz': '+13125550113',
};

/** Signs an API request context in as a demo person through Auth.js, like the web app does. */
async function apiAs(request: APIRequestContext, email: string) {
  const { csrfToken } = await (await request.get('/auth/csrf')).json();
  await request.post('/auth/callback/credentials', {
    form: { csrfToken, email, password: 'bumperline-demo' },
    headers: { 'X-Auth-Return-Redirect': '1' },
  });
}

/** A running game at the venue contact's venue, with no open call. */
async function pickGame(request: APIRequestContext) {
  await apiAs(request, demo.owner);
  const venues = await (await request.get('/api/venues', { params: { q: 'Copper Social Club' } })).json();
  const venue = venues.items[0];
  const games = await (await request.get('/api/games', { params: { venueId: venue.id, status: 'running', limit: 50 } })).json();
  const game = games.items[0];
  const detail = await (await request.get(`/api/games/${game.id}`)).json();
  return { venue, game: detail as { id: string; tagToken: string; model: { title: string }; serial: string } };
}

async function newPage(browser: Browser, javaScriptEnabled = true): Promise<Page> {
  const context = await browser.newContext({ javaScriptEnabled, viewport: { width: 390, height: 844 } });
  return context.newPage();
}

test('report → dispatch → SMS accept → fix → venue sees it closed, downtime recorded', async ({ browser, page, request }) => {
  test.setTimeout(180_000);
  const { venue, game } = await pickGame(request);

  // 1. A bartender reports with JavaScript off: a plain form post.
  const noJs = await newPage(browser, false);
  await noJs.goto(`/t/${game.tagToken}`);
  await expect(noJs.getByRole('heading', { name: game.model.title })).toBeVisible();
  await expect(noJs.getByText(venue.name)).toBeVisible();
  await noJs.getByLabel('Dead — no lights, no power').check();
  await noJs.getByLabel(/Anything else/).fill('Screen dark, coin door light off.');
  await noJs.getByLabel('Mobile number').fill('(312) 555-0177');
  await noJs.getByLabel(/text me updates/).check();
  await noJs.getByRole('button', { name: 'Send report' }).click();
  await expect(noJs.getByRole('link', { name: /status/i })).toBeVisible();
  await noJs.screenshot({ path: 'e2e/screenshots/story-1-receipt-no-js.png', fullPage: true });

  // 2. Someone else reports the same game with JavaScript on: it joins the open call.
  const withJs = await newPage(browser, true);
  await withJs.goto(`/t/${game.tagToken}`);
  await scan(withJs, 'story-2-report-page');
  await withJs.getByLabel('Takes money but gives no credit').check();
  await withJs.getByRole('button', { name: 'Send report' }).click();
  await expect(withJs.getByText(/already/i).first()).toBeVisible();
  const statusHref = await withJs
    .getByRole('link', { name: /status/i })
    .first()
    .getAttribute('href');

  // 3. The dispatcher sees it in the table and on the map, and assigns the suggested technician.
  await signIn(page, demo.dispatcher);
  await page.getByRole('link', { name: 'Calls', exact: true }).click();
  await page.getByRole('searchbox').fill(game.serial);
  const row = page.getByRole('row').filter({ hasText: game.model.title });
  await expect(row).toHaveCount(1);
  await expect(
    page
      .getByRole('figure', { name: /Map of the calls/ })
      .locator('.leaflet-marker-icon')
      .first(),
  ).toBeVisible();
  await scan(page, 'story-3-dispatch');
  await row.getByRole('link').first().click();
  await expect(page.getByRole('heading', { name: new RegExp(game.model.title) })).toBeVisible();
  await expect(page.getByText('Reported again')).toBeVisible();
  const suggested = page.getByRole('listitem').filter({ hasText: 'Suggested' });
  const techName = (await suggested.locator('.font-bold').first().innerText()).trim();
  await suggested.getByRole('button', { name: `Assign ${techName}` }).click();
  await expect(page.getByText(`Technician: ${techName}`)).toBeVisible();
  await scan(page, 'story-3-call-assigned');

  // 4. The technician gets the SMS (sent by the outbox worker through the SDK to the fake) and replies YES.
  const phone = techPhones[techName]!;
  await expect
    .poll(
      async () => {
        const inbox = await (await request.get('/dev/phone.json')).json();
        return JSON.stringify(inbox).includes('Reply YES to accept') && JSON.stringify(inbox).includes(phone);
      },
      { timeout: 60_000, intervals: [1000] },
    )
    .toBe(true);
  const phonePage = await newPage(browser, true);
  await phonePage.goto('/dev/phone');
  await phonePage.getByLabel('Phone number').fill(phone);
  await phonePage.getByLabel('Message').fill('YES');
  await phonePage.getByRole('button', { name: 'Send text' }).first().click();
  await expect(phonePage.getByText(/Accepted call/).first()).toBeVisible({ timeout: 20_000 });
  await phonePage.screenshot({ path: 'e2e/screenshots/story-4-dev-phone.png', fullPage: true });
  await page.reload();
  await expect(page.getByText('(accepted)')).toBeVisible();
  await expect(page.getByText('Accepted the call')).toBeVisible();

  // 5. The technician, on a phone, works the call to fixed and closes it.
  const techPage = await newPage(browser, true);
  const techEmail = {
    'Ilse Brandvold': demo.technician,
    'Kofi Ansah-Whitfield': 'tech2@lakeshore.example',
    'Parveen Lutz': 'tech3@lakeshore.example',
  }[techName]!;
  await signIn(techPage, techEmail);
  await techPage.goto(page.url().replace(/^https?:\/\/[^/]+/, ''));
  for (const move of ['On my way', 'Arrived on site', 'Fixed', 'Close the call']) {
    await techPage.getByRole('button', { name: move }).click();
    await expect(techPage.getByRole('button', { name: move })).toHaveCount(0);
  }
  await expect(techPage.getByText('Closed').first()).toBeVisible();
  await scan(techPage, 'story-5-technician-closed');

  // 6. The reporter's status page says closed; the venue contact sees it closed in the venue view.
  const reporter = await newPage(browser, false);
  await reporter.goto(statusHref!);
  await expect(reporter.getByText('Closed').first()).toBeVisible();
  await reporter.screenshot({ path: 'e2e/screenshots/story-6-status-closed.png', fullPage: true });

  const contact = await newPage(browser, true);
  await contact.goto('/sign-in/request-link');
  await contact.getByLabel('E-mail').fill(demo.venueContact);
  await contact.getByRole('button', { name: 'Send the link' }).click();
  await expect(contact.getByRole('status')).toBeVisible();
  const outbox = await (await request.get('/dev/outbox.json')).json();
  const mail = outbox.messages.find(
    (m: { to: string[]; subject: string }) => m.to.includes(demo.venueContact) && /sign-in link/.test(m.subject),
  );
  const link = new URL(/https?:\/\/\S+/.exec(mail.text)![0]);
  await contact.goto(link.pathname + link.search);
  await contact.getByRole('button', { name: 'Continue' }).click();
  const past = contact.getByRole('region', { name: 'Recent past calls' });
  await expect(past.getByRole('listitem').filter({ hasText: game.model.title }).first()).toContainText('Closed');
  await scan(contact, 'story-6-venue-view');
  // The venue was also e-mailed when the call opened and when it closed: both are in the captured mail.
  const mailPage = await newPage(browser, true);
  // The outbox worker sends on its own schedule: look again until the closing notice has gone out.
  await expect(async () => {
    await mailPage.goto('/dev/outbox');
    for (const what of ['opened', 'closed']) {
      await expect(mailPage.getByRole('heading', { name: `Service call ${what}: ${game.model.title}` }).first()).toBeVisible({
        timeout: 1000,
      });
    }
  }).toPass({ timeout: 45_000 });
  await mailPage.screenshot({ path: 'e2e/screenshots/story-6-venue-mail.png', fullPage: true });

  // 7. The game is running again and its downtime interval is recorded with an end.
  await page.goto(`/games/${game.id}`);
  await expect(page.getByText('Running').first()).toBeVisible();
  const downtime = page.getByRole('table', { name: 'Downtime intervals' });
  await expect(downtime.getByRole('row').nth(1)).not.toContainText('Still down');
  await scan(page, 'story-7-game-downtime');
});
