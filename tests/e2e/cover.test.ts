// Issue 7's end-to-end check at 360 px: the owner arranges a cover, the helper accepts it from
// the e-mail, reads the safety page, sees only the round, records with no network, syncs, and
// the owner's daily report lists it; outside the cover the helper sees when it runs.
import { and, eq, gte } from 'drizzle-orm';
import { describe, expect, it } from 'vitest';
import { addDays, localDateOf, startOfLocalDate } from '#shared/domain/local-dates';
import { events } from '../../server/db/schema/animals';
import { users } from '../../server/db/schema/users';
import { cutNetwork, restoreNetwork, underServiceWorker } from '../chromium';
import { expectAccessible, phonePage, screenshot, signInAsDemo, useE2e } from './support';

const env = useE2e();
const ZONE = 'America/Toronto';

describe('a week’s cover, in a day', () => {
  it('goes from invite to report, and closes when the cover ends', async () => {
    const started = new Date();
    const email = `sitter-${Date.now()}@example.test`;
    const owner = await phonePage(env.browser);
    await signInAsDemo(owner.page, env.server.baseUrl, 'owner@northlight.test');
    await owner.page.getByRole('link', { name: 'Settings' }).click();
    await owner.page.getByRole('link', { name: 'Cover for a helper' }).click();
    await owner.page.getByLabel('Their e-mail').fill(email);
    await owner.page.getByLabel('Message').fill('Feeders are in the blue tub under the rack.');
    await owner.page.getByRole('button', { name: 'Send the invite' }).click();
    await expect.poll(() => owner.page.getByText(`Invite sent to ${email}.`).count()).toBe(1);
    await expectAccessible(owner.page, 'cover page');
    await screenshot(owner.page, 'cover-01-owner');

    // The helper opens the link from the e-mail (the fake mailbox), on their own phone.
    const mail = await env.server.ctx.mailbox.waitFor((m) => m.to.includes(email));
    const link = /https?:\/\/\S+\/cover\/accept\?token=\S+/
      .exec(mail.text)![0]
      .replace(/^https?:\/\/[^/]+/, env.server.baseUrl);
    const helper = await phonePage(env.browser);
    const page = helper.page;
    await page.goto(link);
    await page.getByLabel('Your name').fill('Sam');
    await page.getByLabel('Password').fill('sam covers the feeds');
    await expectAccessible(page, 'accept invite');
    await page.getByRole('button', { name: 'Accept the cover' }).click();
    await page.waitForURL('**/today');

    await page.getByRole('heading', { name: 'Before your first round' }).waitFor();
    expect(await page.getByText('Irritating hairs — protect your eyes').count()).toBeGreaterThan(0);
    expect(await page.getByText(/seek medical advice/).count()).toBe(1);
    await expectAccessible(page, 'safety page');
    await screenshot(page, 'cover-02-safety');
    await page.getByRole('button', { name: 'I have read this and will work safely' }).click();

    // Only the round: no records, no tomorrow, no settings of the collection.
    await page.getByRole('region', { name: 'Handover' }).waitFor();
    const nav = await page
      .getByRole('navigation', { name: 'Main' })
      .getByRole('link')
      .allInnerTexts();
    expect(nav.map((t) => t.trim())).toEqual(['Today', 'Scan', 'Settings']);
    const first = page.getByRole('article').first();
    await first.waitFor();
    // The cautions are spelled out once, above the cards (each card carries its badges).
    expect(await page.getByRole('region', { name: 'Cautions on today’s round' }).count()).toBe(1);
    await expectAccessible(page, 'helper round');
    await screenshot(page, 'cover-03-helper-round');

    await underServiceWorker(page);
    await page.getByRole('article').first().waitFor();
    await cutNetwork(helper.context);
    const fed = page
      .getByRole('article')
      .filter({ has: page.getByRole('button', { name: 'Ate', exact: true }) })
      .first();
    const fedName = (await fed.getAttribute('aria-label'))!.split(',')[0]!;
    await fed.getByRole('button', { name: 'Ate', exact: true }).click();
    await expect
      .poll(() => page.getByText(/1 waiting/).count(), { timeout: 10_000 })
      .toBeGreaterThan(0);
    await restoreNetwork(helper.context);
    await expect
      .poll(() => page.getByText(/All saved/).count(), { timeout: 20_000 })
      .toBeGreaterThan(0);
    const [sam] = await env.server.ctx.database.db
      .select({ id: users.id })
      .from(users)
      .where(eq(users.email, email));
    const saved = await env.server.ctx.database.db
      .select({ kind: events.kind })
      .from(events)
      .where(and(eq(events.recordedBy, sam!.id), gte(events.serverReceivedAt, started)));
    expect(saved.map((e) => e.kind)).toEqual(['ate']);

    // The day ends in Toronto: the report job runs and the owner reads it.
    const today = localDateOf(new Date(), ZONE);
    env.server.ctx.setNow(startOfLocalDate(addDays(today, 1), ZONE));
    // The cover's only day: its report, and the summary of the cover (it ends with the day).
    expect(await env.server.ctx.services.coverReports.runDue()).toBe(2);
    env.server.ctx.setNow(null);
    const report = await env.server.ctx.mailbox.waitFor(
      (m) => m.to.includes('owner@northlight.test') && m.subject.includes('cover report'),
    );
    expect(report.text).toContain(`${fedName} (`);
    expect(report.text).toContain('by Sam');
    await owner.page.reload();
    const reports = owner.page.getByRole('list', { name: 'Cover reports' });
    await reports.getByText(/cover report for/).click();
    await expect.poll(() => reports.innerText()).toContain(`Fed (1)`);
    await screenshot(owner.page, 'cover-04-report');

    // The owner ends the cover: the helper's phone now only says when it ran.
    // Only after a confirmation; the demo helper's own cover is listed too and stays.
    const sams = owner.page
      .getByRole('list', { name: 'Covers' })
      .getByRole('listitem', { name: /^Sam, / });
    await sams.getByRole('button', { name: 'End this cover now…' }).click();
    await sams.getByRole('button', { name: 'End the cover' }).click();
    await expect.poll(() => sams.getAttribute('aria-label')).toBe('Sam, Ended');
    await page.reload();
    await expect
      .poll(() => page.getByText(/Your cover for Northlight Inverts ended on/).count(), {
        timeout: 10_000,
      })
      .toBe(1);
    expect(await page.getByRole('article').count()).toBe(0);
    await screenshot(page, 'cover-05-ended');
    expect(
      helper.consoleErrors.filter(
        (e) => !/ERR_INTERNET_DISCONNECTED|Failed to load resource|status of 403/.test(e),
      ),
    ).toEqual([]);
    expect(owner.consoleErrors).toEqual([]);
  });
});
