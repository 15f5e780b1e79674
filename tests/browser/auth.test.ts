// Accounts in the browser: a newcomer signs up, the demo owner invites them from the members
// screen, the invite mail is read from the mail fake and its link followed, and the newcomer lands
// on the shop's home as a viewer. Also: the wrong-password message. Screenshots at both sizes.
import { afterEach, describe, expect, it } from 'vitest';
import { uniqueEmail } from '../support/accounts';
import { firstLink, Mailbox } from '../support/mailbox';
import { PHONE, WIDE, baseUrl, openBrowser, pageApi, resize, screenshot } from './browser';

type Browser = Awaited<ReturnType<typeof openBrowser>>;
const DEMO_OWNER = { email: 'owner@larchmere.example', password: 'larchmere-owner' };

function mailbox(): Mailbox {
  const dir = process.env.E2E_MAIL_DIR;
  if (!dir) throw new Error('E2E_MAIL_DIR not set: run through vitest.browser.config.mts');
  return new Mailbox(dir);
}

const open: Browser[] = [];
async function browserAt(viewport: { width: number; height: number }) {
  const b = await openBrowser(viewport);
  open.push(b);
  return b.page;
}
afterEach(async () => {
  await Promise.all(open.splice(0).map((b) => b.close()));
});

describe('accounts, shops and invites in the browser', () => {
  it('sign up, get invited by the demo owner, follow the mailed link, and see the shop as a viewer', async () => {
    const email = uniqueEmail('newcomer');
    const newcomer = await browserAt(PHONE);
    const owner = await browserAt(WIDE);

    // The newcomer creates an account on a phone.
    await newcomer.goto(baseUrl() + '/sign-up');
    await newcomer.getByLabel('Your name', { exact: true }).fill('Linnea Brook');
    await newcomer.getByLabel('E-mail', { exact: true }).fill(email);
    await newcomer.getByLabel('Password', { exact: true }).fill('cabinet-scraper-88');
    await screenshot(newcomer, 'sign-up-phone');
    await newcomer.getByTestId('sign-up-submit').click();
    await newcomer.getByTestId('no-shop-card').waitFor({ timeout: 30000 });

    // The demo owner signs in on a wide screen and sends an invite from the members screen.
    await owner.goto(baseUrl() + '/sign-in');
    await owner.getByLabel('E-mail', { exact: true }).fill(DEMO_OWNER.email);
    await owner.getByLabel('Password', { exact: true }).fill(DEMO_OWNER.password);
    await owner.getByTestId('sign-in-submit').click();
    await owner.getByTestId('current-shop-card').getByText('Larchmere Workshop').waitFor({ timeout: 30000 });
    await owner.getByRole('link', { name: 'Members' }).first().click();
    await owner.getByTestId('member-table').getByText('Maren Holt').waitFor({ timeout: 30000 });
    const mails = mailbox();
    const before = mails.countFor(email);
    await owner.getByLabel('Invite by e-mail', { exact: true }).fill(email);
    await owner.getByTestId('send-invite').click();
    await owner.getByText(`Invite sent to ${email}`).waitFor();
    await owner.getByText(email, { exact: true }).waitFor(); // listed under the open invites
    await screenshot(owner, 'members-owner-wide');

    // The invite arrives by mail; its link opens the invite screen for the newcomer.
    const mail = await mails.latestFor(email, { after: before, timeoutMs: 10000 });
    expect(mail.subject).toBe('Join Larchmere Workshop on Jigwright');
    const link = firstLink(mail);
    expect(link.startsWith(`${baseUrl()}/invite/`)).toBe(true);
    await newcomer.goto(link);
    await newcomer.getByText('You are invited to Larchmere Workshop as a viewer', { exact: false }).waitFor({ timeout: 30000 });
    await screenshot(newcomer, 'invite-phone');
    await newcomer.getByTestId('accept-invite').click();

    // Joined: home shows the shop and the role.
    await newcomer.waitForURL(baseUrl() + '/');
    const card = newcomer.getByTestId('current-shop-card');
    await card.getByText('Larchmere Workshop').waitFor({ timeout: 30000 });
    expect(await newcomer.getByTestId('current-role').textContent()).toMatch(/^You are a viewer here/);
    // Below it, the designs changed last, newest first, as the library's own sort gives them.
    const shops = (await pageApi<{ shops: { id: string; name: string }[] }>(newcomer, '/me')).shops;
    const larchmere = shops.find((x) => x.name === 'Larchmere Workshop')!;
    const latest = (await pageApi<{ items: { id: string; title: string }[] }>(newcomer, `/shops/${larchmere.id}/designs?sort=updated&dir=desc&limit=4`)).items;
    expect(latest.length).toBeGreaterThan(0);
    const recent = newcomer.getByTestId('recent-work');
    await recent.getByTestId(`design-card-${latest[0].id}`).waitFor({ timeout: 30000 });
    const shownIds = await recent.locator('[data-testid^="design-card-"]').evaluateAll((els) => els.map((e) => e.getAttribute('data-testid')!.replace('design-card-', '')));
    expect(shownIds).toEqual(latest.map((d) => d.id));
    // A viewer is not offered drawing a new insert; everyone gets the whole library.
    expect(await recent.getByTestId('recent-work-charger-insert').count()).toBe(0);
    await recent.getByTestId('recent-work-library').waitFor();
    await screenshot(newcomer, 'home-viewer-phone');
    await resize(newcomer, WIDE);
    await card.getByText('Larchmere Workshop').waitFor();
    await screenshot(newcomer, 'home-viewer-wide');

    // As a viewer the members screen is a list on the phone, without the owner's controls.
    await resize(newcomer, PHONE);
    await newcomer.goto(baseUrl() + '/shop/members');
    await newcomer.getByTestId('member-list').getByText('Linnea Brook (you)').waitFor({ timeout: 30000 });
    expect(await newcomer.getByTestId('invite-form').count()).toBe(0);
    await screenshot(newcomer, 'members-viewer-phone');
  });

  it('signs out every other session from the account screen, and this one stays', async () => {
    const page = await browserAt(PHONE);
    await page.goto(baseUrl() + '/help/safety');
    const person = { email: uniqueEmail('benchhand'), password: 'marking-gauge-77', name: 'Ivo Hale' };
    const status = await page.evaluate(async (body) => (await fetch('/api/auth/sign-up', { method: 'POST', credentials: 'include', headers: { 'Content-Type': 'application/json', 'X-Jigwright-CSRF': '1' }, body: JSON.stringify(body) })).status, person);
    expect(status).toBe(201);
    // A second device: the same account signed in from outside this browser.
    const other = await fetch(`${baseUrl()}/api/auth/sign-in`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ email: person.email, password: person.password }) });
    const otherToken = ((await other.json()) as { token: string }).token;
    await page.goto(baseUrl() + '/account');
    await page.getByTestId('sign-out-others').click();
    await page.getByTestId('sign-out-others-done').getByText('Signed out of one other session.').waitFor({ timeout: 30000 });
    await screenshot(page, 'account-sign-out-others-phone');
    expect((await fetch(`${baseUrl()}/api/me`, { headers: { authorization: `Bearer ${otherToken}` } })).status).toBe(401);
    // This browser is still signed in.
    await page.reload();
    await page.getByText(person.email).waitFor({ timeout: 30000 });
  });

  for (const [label, viewport] of [['phone', PHONE], ['wide', WIDE]] as const) {
    it(`says so when the password is wrong (${label})`, async () => {
      const page = await browserAt(viewport);
      await page.goto(baseUrl() + '/sign-in');
      await page.getByLabel('E-mail', { exact: true }).fill(DEMO_OWNER.email);
      await page.getByLabel('Password', { exact: true }).fill('not-the-right-one');
      await page.getByTestId('sign-in-submit').click();
      await page.getByText('That e-mail and password do not match an account').waitFor({ timeout: 30000 });
      expect(page.url()).toBe(baseUrl() + '/sign-in'); // still on the form, not signed in
      await screenshot(page, `sign-in-wrong-password-${label}`);
      // With no network at all the form says so in words, keeps what was typed, and signs in once it is back.
      await page.context().setOffline(true);
      await page.getByLabel('Password', { exact: true }).fill(DEMO_OWNER.password);
      await page.getByTestId('sign-in-submit').click();
      await page.getByText('No answer from the server: check the connection and try again').waitFor({ timeout: 30000 });
      expect(await page.getByLabel('E-mail', { exact: true }).inputValue()).toBe(DEMO_OWNER.email);
      await screenshot(page, `sign-in-offline-${label}`);
      await page.context().setOffline(false);
      await page.getByTestId('sign-in-submit').click();
      await page.waitForURL(baseUrl() + '/', { timeout: 30000 });
      // The short-password rule from the shared schema shows before anything is sent.
      await page.goto(baseUrl() + '/sign-up');
      await page.getByLabel('Password', { exact: true }).fill('short');
      await page.getByTestId('sign-up-submit').click();
      await page.getByText('Use at least 10 characters').waitFor();
      await page.getByText('Enter your e-mail address').waitFor();
    });
  }
});
