// Sign-up by an e-mailed link and invite-only membership, at 360 px: a new person asks for a
// link, finishes the account from it and lands on their own round; they invite an existing
// account as a keeper, who joins only by accepting and can leave again.
import { describe, expect, it } from 'vitest';
import { expectAccessible, phonePage, screenshot, signInAsDemo, useE2e } from './support';

const env = useE2e();
const onThisServer = (link: string) => link.replace(/^https?:\/\/[^/]+/, env.server.baseUrl);

describe('accounts and members', () => {
  it('signs up from the e-mailed link, invites a keeper who accepts and then leaves', async () => {
    const email = `newcomer-${Date.now()}@example.test`;
    const mailbox = env.server.ctx.mailbox;
    const newcomer = await phonePage(env.browser);
    const page = newcomer.page;
    await page.goto(`${env.server.baseUrl}/sign-up`);
    await page.getByLabel('E-mail').fill(email);
    await page.getByRole('button', { name: 'Send me a sign-up link' }).click();
    await expect
      .poll(() =>
        page
          .getByText(`Check your e-mail: we have sent a message to ${email} with the next step.`, {
            exact: false,
          })
          .count(),
      )
      .toBe(1);
    await expectAccessible(page, 'sign-up sent');
    await screenshot(page, 'accounts-01-sign-up-sent');

    const mail = await mailbox.waitFor(
      (m) => m.to.includes(email) && m.subject === 'Finish making your Rackside account',
    );
    await page.goto(
      onThisServer(/https?:\/\/\S+\/sign-up\/finish\?token=[\w-]+/.exec(mail.text)![0]),
    );
    await expect.poll(() => page.getByText(email).count()).toBe(1);
    await page.getByLabel('Your name').fill('Rowan');
    await page.getByLabel('Password', { exact: true }).fill('rowan keeps slings');
    await page.getByLabel('Collection name').fill('Rowan racks');
    await page.getByLabel('Time zone').fill('America/Toronto');
    await expectAccessible(page, 'sign-up finish');
    await screenshot(page, 'accounts-02-finish');
    await page.getByRole('button', { name: 'Create account' }).click();
    await page.waitForURL('**/today');
    await expect.poll(() => page.getByText('Rowan racks').first().isVisible()).toBe(true);

    // The owner invites an existing account: nothing changes for them until they accept.
    await page.getByRole('link', { name: 'Settings' }).click();
    await page.getByRole('link', { name: 'People: invite a partner or a keeper' }).click();
    await page.getByRole('heading', { name: 'Who keeps this collection' }).waitFor();
    await page.getByLabel('Their e-mail').fill('partner@northlight.test');
    await page.getByRole('button', { name: 'Send the invite' }).click();
    await expect
      .poll(() =>
        page
          .getByText(
            'We have e-mailed an invite to partner@northlight.test. They join when they accept it.',
          )
          .count(),
      )
      .toBe(1);
    await expect
      .poll(() => page.getByRole('list', { name: 'Invites waiting for an answer' }).innerText())
      .toContain('partner@northlight.test');
    await expectAccessible(page, 'members');
    await screenshot(page, 'accounts-03-members');

    const invite = await mailbox.waitFor(
      (m) =>
        m.to.includes('partner@northlight.test') &&
        m.subject.includes('invites you to keep Rowan racks'),
    );
    const partner = await phonePage(env.browser);
    await signInAsDemo(partner.page, env.server.baseUrl, 'partner@northlight.test');
    await partner.page.goto(
      onThisServer(/https?:\/\/\S+\/join\?token=[\w-]+/.exec(invite.text)![0]),
    );
    await partner.page.getByRole('heading', { name: 'Keep Rowan racks' }).waitFor();
    await expectAccessible(partner.page, 'join');
    await screenshot(partner.page, 'accounts-04-join');
    await partner.page.getByRole('button', { name: 'Accept the invite' }).click();
    await partner.page.waitForURL('**/today');
    await expect.poll(() => partner.page.getByText('Rowan racks').first().isVisible()).toBe(true);

    await partner.page.getByRole('link', { name: 'Settings' }).click();
    await partner.page.getByRole('button', { name: 'Leave this collection…' }).click();
    await partner.page.getByRole('button', { name: 'Leave the collection' }).click();
    await partner.page.waitForURL('**/today');
    await expect
      .poll(() => partner.page.getByText('Northlight Inverts').first().isVisible())
      .toBe(true);
    const me = (await (
      await partner.page.request.get(`${env.server.baseUrl}/api/auth/me`)
    ).json()) as { memberships: { collectionName: string }[] };
    expect(me.memberships.map((m) => m.collectionName)).not.toContain('Rowan racks');
    expect(newcomer.consoleErrors, newcomer.consoleErrors.join(' | ')).toEqual([]);
    expect(partner.consoleErrors, partner.consoleErrors.join(' | ')).toEqual([]);
    await newcomer.context.close();
    await partner.context.close();
  });
});
