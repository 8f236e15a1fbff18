// Each role signs in and walks its screens in Chromium; every screen is scanned with axe.
import { expect, test, type APIRequestContext } from '@playwright/test';
import { demo, failOnConsoleErrors, openSection, scan, signIn } from './fixtures.ts';

test('visitors see the landing page and the sign-in page', async ({ page }) => {
  const check = failOnConsoleErrors(page);
  await page.goto('/');
  await expect(page.getByRole('heading', { level: 1 })).toContainText('Keep every game');
  await scan(page, 'landing');
  await page.getByRole('link', { name: 'Sign in' }).first().click();
  await expect(page.getByRole('heading', { name: 'Sign in' })).toBeVisible();
  await scan(page, 'sign-in');
  check();
});

test('a wrong password is refused with a clear message', async ({ page }) => {
  await page.goto('/sign-in');
  await page.getByLabel('E-mail').fill(demo.owner);
  await page.getByLabel('Password').fill('not the password');
  await page.getByRole('button', { name: 'Sign in' }).click();
  await expect(page.getByRole('alert')).toContainText('do not match');
});

test('owner: today, venues, a venue, adding and editing a venue, games, a game, team, activity', async ({ page }) => {
  const check = failOnConsoleErrors(page);
  await signIn(page, demo.owner);
  await expect(page.getByRole('heading', { name: 'Today' })).toBeVisible();
  await expect(page.getByRole('heading', { name: 'Down now' })).toBeVisible();
  await scan(page, 'owner-today');

  await page.getByRole('link', { name: 'Venues' }).click();
  await expect(page.getByRole('table', { name: 'Venues' })).toBeVisible();
  await expect(page.getByRole('table', { name: 'Venues' }).getByRole('row')).toHaveCount(26);
  await scan(page, 'owner-venues');
  await page.getByRole('searchbox').fill('Juniper');
  await expect(page.getByRole('table', { name: 'Venues' }).getByRole('row')).toHaveCount(3);
  await page.getByRole('button', { name: 'City' }).click();
  await expect(page).toHaveURL(/sort=city/);

  await page.getByRole('link', { name: 'Add venue' }).click();
  await page.getByRole('button', { name: 'Add venue' }).click();
  await expect(page.getByText('Is required').first()).toBeVisible();
  await scan(page, 'owner-venue-new');
  await page.getByLabel('Name', { exact: true }).fill('Test Kitchen Arcade');
  await page.getByLabel('Street address').fill('88 Brackett Blvd');
  await page.getByLabel('City', { exact: true }).fill('Chicago');
  await page.getByLabel('Latitude').fill('41.8902');
  await page.getByLabel('Longitude').fill('-87.6262');
  await page.getByRole('button', { name: 'Add venue' }).click();
  await expect(page.getByRole('heading', { name: 'Test Kitchen Arcade' })).toBeVisible();
  await scan(page, 'owner-venue');
  await page.getByRole('link', { name: 'Edit' }).click();
  await page.getByLabel('Name', { exact: true }).fill('Test Kitchen Arcade & Bar');
  await page.getByRole('button', { name: 'Save changes' }).click();
  await expect(page.getByRole('heading', { name: 'Test Kitchen Arcade & Bar' })).toBeVisible();
  await expect(page.getByText('name: Test Kitchen Arcade → Test Kitchen Arcade & Bar')).toBeVisible();

  await page.getByRole('link', { name: 'Games', exact: true }).click();
  await expect(page.getByRole('table', { name: 'Games' })).toBeVisible();
  await page.getByLabel('Status').selectOption('down');
  await expect(page).toHaveURL(/status=down/);
  await scan(page, 'owner-games');
  await page.getByRole('table', { name: 'Games' }).getByRole('link').first().click();
  await expect(page.getByText('Down', { exact: true }).first()).toBeVisible();
  await scan(page, 'owner-game');

  await page.getByRole('link', { name: 'Team' }).click();
  await expect(page.getByRole('cell', { name: 'Devon Castellanos' })).toBeVisible();
  await page.getByLabel('E-mail').fill('new.tech@lakeshore.example');
  await page.getByRole('button', { name: 'Send invitation' }).click();
  await expect(page.getByRole('status')).toContainText('Invitation e-mailed');
  await expect(page.getByText('new.tech@lakeshore.example', { exact: true })).toBeVisible();
  await scan(page, 'owner-team');

  await page.getByRole('link', { name: 'Activity' }).click();
  await expect(page.getByText(/invited invitation/)).toBeVisible();
  await scan(page, 'owner-activity');
  check();
});

test('dispatcher: venues and games, no team management, no activity', async ({ page }) => {
  await signIn(page, demo.dispatcher);
  await expect(page.getByRole('link', { name: 'Activity' })).toHaveCount(0);
  await page.getByRole('link', { name: 'Team' }).click();
  await expect(page.getByRole('button', { name: 'Send invitation' })).toHaveCount(0);
  await scan(page, 'dispatcher-team');
  await page.getByRole('link', { name: 'Games', exact: true }).click();
  await expect(page.getByRole('link', { name: 'Add game' })).toBeVisible();
  await scan(page, 'dispatcher-games');
});

test('technician (on a phone): reads games and venues, cannot edit, switches company', async ({ page }) => {
  await page.setViewportSize({ width: 390, height: 844 });
  await signIn(page, demo.technician);
  // A technician's home is My day.
  await expect(page.getByRole('heading', { name: 'My day' })).toBeVisible();
  await scan(page, 'technician-today');
  await openSection(page, 'Games');
  await expect(page.getByRole('link', { name: 'Add game' })).toHaveCount(0);
  await scan(page, 'technician-games');
  await page.goto('/venues/new');
  await expect(page.getByRole('heading', { name: 'Not available for your role' })).toBeVisible();
  // Ilse also works for the second company.
  await page.getByRole('navigation', { name: 'Main' }).getByRole('button', { name: 'More' }).click();
  await page
    .getByRole('dialog', { name: 'Menu' })
    .getByRole('combobox', { name: 'Company' })
    .selectOption({ label: 'Prairie Pinball Partners (Technician)' });
  await expect(page.getByRole('dialog', { name: 'Menu' })).toBeHidden();
  await openSection(page, 'Venues');
  await expect(page.getByRole('link', { name: 'Gravel Road Roadhouse' })).toBeVisible();
  await expect(page.getByRole('link', { name: /Juniper/ })).toHaveCount(0);
  await scan(page, 'technician-second-company');
});

test('venue contact signs in by an e-mailed link and sees the venue view', async ({ page, request }) => {
  await page.goto('/sign-in');
  await page.getByRole('link', { name: /Get a sign-in link/ }).click();
  await page.getByLabel('E-mail').fill(demo.venueContact);
  await page.getByRole('button', { name: 'Send the link' }).click();
  await expect(page.getByRole('status')).toContainText('link is on its way');
  await scan(page, 'venue-contact-request-link');
  const outbox = await (await request.get('/dev/outbox.json')).json();
  const mail = outbox.messages.find((m: { to: string[] }) => m.to.includes(demo.venueContact));
  const link = /https?:\/\/\S+/.exec(mail.text)![0];
  await page.goto(new URL(link).pathname + new URL(link).search);
  await page.getByRole('button', { name: 'Continue' }).click();
  await expect(page.getByRole('heading', { name: 'Your games at Copper Social Club' })).toBeVisible();
  await expect(page.getByRole('link', { name: 'Venues' })).toHaveCount(0);
  await scan(page, 'venue-contact-home');
});

test('second company sees only its own venues', async ({ page }) => {
  await signIn(page, demo.secondOwner);
  await page.getByRole('link', { name: 'Venues' }).click();
  await expect(page.getByRole('table', { name: 'Venues' }).getByRole('row')).toHaveCount(4);
  await expect(page.getByRole('link', { name: /Juniper/ })).toHaveCount(0);
});

/** The newest captured e-mail to `address` whose subject matches, and the first link in it (path and query). */
async function mailedLink(request: APIRequestContext, address: string, subject: RegExp): Promise<string> {
  const outbox = await (await request.get('/dev/outbox.json')).json();
  const mail = outbox.messages.find((m: { to: string[]; subject: string }) => m.to.includes(address) && subject.test(m.subject));
  expect(mail, `an e-mail to ${address} about ${subject}`).toBeTruthy();
  const link = new URL(/https?:\/\/\S+/.exec(mail.text)![0]);
  return link.pathname + link.search;
}

test('sign up: confirm the address by e-mail, then sign in to the new company; sign out ends it', async ({ page, request }) => {
  const email = 'robin@testflippers.example';
  const password = 'a much longer passphrase';
  await page.goto('/sign-up');
  await scan(page, 'sign-up');
  await page.getByLabel('Company name').fill('Test Flippers LLC');
  await page.getByLabel('Your name').fill('Robin Test');
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill('short');
  await page.getByRole('button', { name: 'Create company' }).click();
  await expect(page.getByText('Must be at least 10 characters')).toBeVisible();
  await page.getByLabel('Password').fill(password);
  await page.getByRole('button', { name: 'Create company' }).click();
  await expect(page.getByRole('heading', { name: 'Check your e-mail' })).toBeVisible();
  await expect(page.getByText(email)).toBeVisible();
  await scan(page, 'sign-up-check-email');

  // The password does not sign in until the address is confirmed; the sign-in page offers the link again.
  await page.getByRole('link', { name: 'Go to sign in' }).click();
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(password);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await expect(page.getByRole('alert')).toContainText('Confirm your e-mail address first');
  await scan(page, 'sign-in-unconfirmed');
  await page.getByRole('button', { name: 'Send the link again' }).click();
  await expect(page.getByRole('status')).toContainText('a new link is on its way');
  await scan(page, 'sign-in-unconfirmed-resent');

  await page.goto(await mailedLink(request, email, /Confirm/));
  await expect(page.getByRole('heading', { name: 'Confirm your e-mail address' })).toBeVisible();
  await page.getByLabel('Password').fill(password);
  await scan(page, 'verify-email');
  await page.getByRole('button', { name: 'Confirm my address' }).click();
  await expect(page.getByRole('status')).toContainText('address is confirmed');
  await scan(page, 'verify-email-done');
  await page.getByRole('link', { name: 'Sign in' }).click();
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(password);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await expect(page.getByRole('heading', { name: 'Today' })).toBeVisible();
  await expect(page.getByText('Test Flippers LLC')).toBeVisible();
  await page.getByRole('link', { name: 'Venues' }).click();
  await expect(page.getByText('No venues yet.')).toBeVisible();
  await scan(page, 'new-company-venues-empty');
  await page.getByRole('button', { name: 'Sign out' }).click();
  await expect(page.getByRole('heading', { name: 'Sign in' })).toBeVisible();
  await page.goto('/venues');
  await expect(page.getByRole('heading', { name: 'Sign in' })).toBeVisible();
});

test('password reset by e-mail', async ({ page, request }) => {
  // Its own person, signed up and confirmed through the API, so it depends on no other test.
  const email = 'reset.person@resetting.example';
  const headers = { 'X-Requested-With': 'bumperline' };
  const signUp = await request.post('/api/account/sign-up', {
    headers,
    data: { companyName: 'Resetting Amusements', name: 'Rene Reset', email, password: 'the first passphrase' },
  });
  expect(signUp.status()).toBe(202);
  const confirm = new URL(await mailedLink(request, email, /Confirm/), 'http://x').searchParams.get('token');
  expect(
    (await request.post('/api/account/verify-email', { headers, data: { token: confirm, password: 'the first passphrase' } })).status(),
  ).toBe(204);

  await page.goto('/forgot-password');
  await page.getByLabel('E-mail').fill(email);
  await page.getByRole('button', { name: 'Send the link' }).click();
  await expect(page.getByRole('status')).toBeVisible();
  await page.goto(await mailedLink(request, email, /Reset/));
  await page.getByLabel('New password').fill('the second passphrase');
  await page.getByLabel('Repeat it').fill('the second passphrase');
  await page.getByRole('button', { name: 'Set password' }).click();
  await expect(page.getByRole('status')).toContainText('password is changed');
  await scan(page, 'reset-password-done');
  await page.goto('/sign-in');
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill('the second passphrase');
  await page.getByRole('button', { name: 'Sign in' }).click();
  await expect(page.getByRole('heading', { name: 'Today' })).toBeVisible();
});
