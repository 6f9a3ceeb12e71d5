import { and, eq } from 'drizzle-orm';
import { describe, expect, it } from 'vitest';
import { localDateOf } from '#shared/domain/local-dates';
import { animals } from '../../server/db/schema/animals';
import { demoCollectionId } from '../../server/seed/demo';
import {
  expectAccessible,
  followPublicLinks,
  phonePage,
  screenshot,
  signInAsDemo,
  useE2e,
} from './support';

const env = useE2e();

describe('sales at 360 × 740', () => {
  it('a clutch from stock to shipped: reserve three slings, invoice, card checkout, ship, sold with care sheets', async () => {
    const db = env.server.ctx.database.db;
    const collectionId = (await demoCollectionId(db))!;
    const { context, page, consoleErrors } = await phonePage(env.browser);
    await followPublicLinks(context, env.server.baseUrl);
    await signInAsDemo(page, env.server.baseUrl, 'owner@northlight.test');
    await page.getByRole('link', { name: 'Sales', exact: true }).click();
    await page.waitForURL('**/sales');

    // The demo offers 12 of its clutch at CAD 25.00: take three for a buyer.
    await page.getByRole('button', { name: 'Reserve animals for a buyer' }).click();
    await page.getByLabel('How many from H. formosus sac 1').fill('3');
    await page.getByRole('button', { name: 'Take them' }).click();
    await page.getByText('3 chosen · CA$75.00').waitFor();
    await expectAccessible(page, 'reserve');
    await screenshot(page, 'sales-01-reserve');
    await page.getByRole('button', { name: 'Reserve 3 animals' }).click();
    await page.getByRole('heading', { name: 'Maren Lindqvist · Reserved' }).waitFor();

    // The invoice: three slings and shipping, 13 % HST on the whole (Ontario's HST rate, from
    // memory: Government of Canada, GST/HST rates).
    await page.getByLabel('Shipping (CAD)').fill('30');
    await page.getByRole('button', { name: 'Issue the invoice' }).click();
    // 75.00 + 30.00 = 105.00; 13 % = 13.65; total 118.65.
    await page.getByRole('cell', { name: 'CA$118.65' }).waitFor();
    await page.getByText('Not paid yet: CA$118.65 to pay.').waitFor();
    // The invoice e-mail carries the PDF and the card link.
    await page.getByRole('button', { name: 'E-mail to the buyer' }).click();
    const invoiceMail = await env.server.ctx.mailbox.waitFor((m) =>
      m.subject.startsWith('Invoice '),
    );
    expect(invoiceMail.text).toContain(
      `Pay by card on the payment service's secure page: ${env.server.paymentFake.url}/pay/`,
    );
    expect(invoiceMail.attachments?.map((a) => a.contentType)).toEqual(['application/pdf']);

    // The buyer pays by card on the payment service's page (the local fake), in a new tab.
    const [checkout] = await Promise.all([
      context.waitForEvent('page'),
      page.getByRole('button', { name: 'Open card checkout (CA$118.65)' }).click(),
    ]);
    // The service's public test cards: a declined one first, then one that pays.
    const card = checkout.getByLabel('Card number (test cards only)');
    const pay = checkout.getByRole('button', { name: /^Pay .*118\.65$/ });
    await card.fill('4000 0000 0000 0002');
    await pay.click();
    await checkout.getByRole('alert').getByText('Your card was declined.').waitFor();
    await expectAccessible(checkout, 'checkout declined');
    await screenshot(checkout, 'sales-02b-checkout-declined');
    await card.fill('4242 4242 4242 4242');
    await pay.click();
    await checkout.getByRole('heading', { name: 'Thank you: payment received' }).waitFor();
    await expectAccessible(checkout, 'payment done');
    await checkout.close();
    // The signed webhook marked it paid; the keeper's page shows it on its next read.
    await page.reload();
    await page.getByText('Paid in full (CA$118.65 received).').scrollIntoViewIfNeeded();
    await screenshot(page, 'sales-02a-paid');

    // Shipping: a frosty route needs "ship anyway".
    const today = localDateOf(new Date(), 'America/Toronto');
    await page.getByLabel('Ship on').fill(today);
    await page.getByLabel('Route', { exact: true }).fill('Toronto to Ottawa');
    await page.getByLabel('Forecast low (°C)').fill('2');
    await page.getByLabel('Forecast high (°C)').fill('9');
    await page.getByRole('button', { name: 'Save shipping' }).click();
    await page
      .getByText(/forecast low \(2\.0 °C\) is below your safe minimum of 5\.0 °C/)
      .waitFor();
    const confirm = page.getByRole('button', { name: 'Confirm the shipping check' });
    expect(await confirm.isDisabled()).toBe(true);
    await page.getByLabel('I have weighed this and ship anyway').check();
    await confirm.click();
    await page.getByText('Shipping check confirmed.').waitFor();
    await expectAccessible(page, 'sale');
    await screenshot(page, 'sales-02-sale');
    await page.setViewportSize({ width: 1280, height: 800 });
    await screenshot(page, 'sales-02-sale-1280');
    await page.setViewportSize({ width: 360, height: 740 });

    // Shipped: the animals leave the collection as sold, each with its care sheet.
    await page.getByRole('button', { name: 'Shipped: mark the animals sold' }).click();
    await page.getByRole('heading', { name: 'Maren Lindqvist · Shipped' }).waitFor();
    const sheets = page.getByRole('link', { name: 'Care sheet (PDF)' });
    expect(await sheets.count()).toBe(3);
    const href = (await sheets.first().getAttribute('href'))!;
    const sheet = await page.request.get(new URL(href, env.server.baseUrl).href);
    expect(sheet.headers()['content-type']).toBe('application/pdf');
    const note = await env.server.ctx.mailbox.waitFor((m) =>
      m.subject.startsWith('Your animals from Northlight Inverts'),
    );
    expect(note.attachments?.filter((a) => a.contentType === 'application/pdf')).toHaveLength(3);
    const sold = await db
      .select({ status: animals.status })
      .from(animals)
      .where(and(eq(animals.collectionId, collectionId), eq(animals.clutch, 'H. formosus sac 1')));
    expect(sold.filter((a) => a.status === 'sold')).toHaveLength(3);
    await page
      .getByRole('link', { name: /Hapalopus formosus/ })
      .first()
      .click();
    await page.getByText(/^Sold to Maren Lindqvist on /).waitFor();
    await expectAccessible(page, 'sold animal');
    await screenshot(page, 'sales-03-sold-animal');

    expect(consoleErrors).toEqual([]);
    await context.close();
  }, 60_000);
});

describe('sales settings and buyers at 360 × 740', () => {
  it('saves a tax rate typed as a percent and adds a buyer', async () => {
    const { context, page, consoleErrors } = await phonePage(env.browser);
    await signInAsDemo(page, env.server.baseUrl, 'owner@northlight.test');
    await page.goto(`${env.server.baseUrl}/sales/settings`);
    await page.getByText('Per invoice: the lines are added up first').waitFor();
    await page.getByLabel('Tax rate (%)').fill('13.5');
    await page.getByRole('button', { name: 'Save sales settings' }).click();
    await page.getByText('Sales settings saved.').waitFor();
    await expectAccessible(page, 'sales settings');
    await screenshot(page, 'sales-04-settings');
    const saved = await page.evaluate(async () => {
      const me = await (await fetch('/api/auth/me')).json();
      const id = me.memberships[0].collectionId;
      return (await (await fetch(`/api/collections/${id}/sales-settings`)).json()).taxRateBp;
    });
    expect(saved).toBe(1350);

    await page.getByRole('link', { name: '← Sales' }).click();
    await page.getByRole('link', { name: 'Buyers' }).click();
    // The first flow sold Maren three slings: her card counts the sale.
    await page.getByText('1 sale', { exact: true }).waitFor();
    await page.getByRole('button', { name: 'Add a buyer' }).click();
    await page.getByLabel('Name').fill('Tobias Renner');
    await page.getByLabel('E-mail').fill('tobias@example.test');
    await page.getByRole('button', { name: 'Add buyer' }).click();
    await page.getByText('Tobias Renner').waitFor();
    await expectAccessible(page, 'buyers');
    await screenshot(page, 'sales-05-buyers');
    expect(consoleErrors).toEqual([]);
    await context.close();
  }, 30_000);
});
