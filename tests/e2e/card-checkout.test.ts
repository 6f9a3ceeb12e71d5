// The buyer's side of card payment, at 360 px: the local fake's checkout page (a declined test
// card, then the paying one), back to Rackside's thank-you page, and the invoice paid by the
// signed webhook. The keeper's side (InvoicePayment on the sale's page) is in the sales flow.
import { randomUUID } from 'node:crypto';
import { describe, expect, it } from 'vitest';
import { DEMO_PASSWORD } from '../../server/access/demo-people';
import { buyers, invoices, sales } from '../../server/db/schema/sales';
import { expectAccessible, followPublicLinks, phonePage, screenshot, useE2e } from './support';

const env = useE2e();

describe('card checkout', () => {
  it('declines the declined test card, pays with the paying one, and the invoice is paid', async () => {
    const { ctx, baseUrl } = env.server;
    const keeper = ctx.agent();
    const me = await keeper
      .post('/api/auth/sign-in')
      .send({ email: 'owner@northlight.test', password: DEMO_PASSWORD })
      .expect(200);
    const collectionId = me.body.memberships[0].collectionId as string;
    const db = ctx.database.db;
    const [buyer] = await db
      .insert(buyers)
      .values({ collectionId, name: 'Checkout buyer' })
      .returning();
    const [sale] = await db
      .insert(sales)
      .values({ collectionId, buyerId: buyer!.id, reservedUntil: '2099-01-01' })
      .returning();
    const [invoice] = await db
      .insert(invoices)
      .values({
        collectionId,
        saleId: sale!.id,
        number: `E2E-${randomUUID().slice(0, 6)}`,
        currency: 'CAD',
        taxRateBp: 1300,
        taxRounding: 'per_invoice',
        subtotalMinor: 9000,
        shippingMinor: 1500,
        taxMinor: 1170,
        totalMinor: 10170,
        issuedOn: '2026-12-03',
      })
      .returning();
    const base = `/api/collections/${collectionId}/invoices/${invoice!.id}`;
    const { url } = (await keeper.post(`${base}/checkout`).expect(200)).body;

    // The same page on a desktop browser.
    const wide = await env.browser.newPage({ viewport: { width: 1280, height: 800 } });
    await wide.goto(url);
    await wide.getByRole('button', { name: 'Pay $101.70' }).waitFor();
    await screenshot(wide, 'card-checkout-00-page-1280');
    await wide.close();

    const { context, page, consoleErrors } = await phonePage(env.browser);
    await followPublicLinks(context, baseUrl);
    await page.goto(url);
    await page.getByText('$101.70').first().waitFor();
    await expectAccessible(page, 'checkout page');
    await screenshot(page, 'card-checkout-01-page');

    await page.getByLabel('Card number (test cards only)').fill('4000 0000 0000 0002');
    await page.getByRole('button', { name: 'Pay $101.70' }).click();
    await page.getByRole('alert').getByText('Your card was declined.').waitFor();
    await expectAccessible(page, 'checkout declined');
    await screenshot(page, 'card-checkout-02-declined');
    const declined = (await keeper.get(`${base}/payments`).expect(200)).body;
    expect(declined.invoice.status).toBe('open');
    expect(declined.lastDecline.message).toBe('The card was declined.');

    await page.getByLabel('Card number (test cards only)').fill('4242 4242 4242 4242');
    await page.getByRole('button', { name: 'Pay $101.70' }).click();
    await page.waitForURL('**/payment/done?result=paid**');
    await page.getByRole('heading', { name: 'Thank you: payment received' }).waitFor();
    await expectAccessible(page, 'payment done');
    await screenshot(page, 'card-checkout-03-done');
    const paid = (await keeper.get(`${base}/payments`).expect(200)).body;
    expect(paid.invoice).toMatchObject({ status: 'paid', paidMinor: 10170 });
    expect(consoleErrors).toEqual([]);
  }, 30_000);
});
