// Room climate at 360 px: the owner types the spare room's morning reading on Today with no
// signal and a value above its range, sees the out-of-range notice at once and the reading
// kept across a reload; with the signal back it is sent once (a room chore, decision 020), and
// the owners' morning e-mail (the job run with the app's clock moved to the next morning)
// reaches the dev mailbox.
import { and, eq, gte } from 'drizzle-orm';
import { describe, expect, it } from 'vitest';
import { addDays, localDateOf } from '#shared/domain/local-dates';
import { DEMO_COLLECTION } from '../../server/access/demo-people';
import { animals } from '../../server/db/schema/animals';
import { climateReadings } from '../../server/db/schema/climate';
import { morningOf } from '../../server/features/climate/daily-mail';
import { cutNetwork, restoreNetwork, underServiceWorker } from '../chromium';
import { expectAccessible, phonePage, screenshot, signInAsDemo, useE2e } from './support';

const env = useE2e();

describe('room climate', () => {
  it('keeps a reading typed offline, shows it out of range at once, sends it once, and mails it', async () => {
    const { context, page, consoleErrors } = await phonePage(env.browser);
    const started = new Date();
    const typedOnServer = async () =>
      (
        await env.server.ctx.database.db
          .select({ max: climateReadings.maxCelsius })
          .from(climateReadings)
          .where(
            and(
              eq(climateReadings.room, 'Spare room'),
              eq(climateReadings.source, 'typed'),
              gte(climateReadings.takenAt, started),
            ),
          )
      ).map((r) => r.max);
    await signInAsDemo(page, env.server.baseUrl, 'owner@northlight.test');
    await underServiceWorker(page);
    const card = page.getByRole('form', { name: 'Climate reading for Spare room' });
    await card.waitFor();
    await card.getByLabel('Lowest').fill('23');
    await card.getByLabel('Highest').fill('30.5');
    await card.getByLabel('Humidity').fill('66');
    await screenshot(page, 'climate-00-today-reading');
    await cutNetwork(context);
    await card.getByRole('button', { name: 'Save reading' }).click();
    // The demo's range is 22–27 °C: 30.5 °C is above it, said before the server has it.
    const alert = page.getByTestId('climate-alert');
    const above = 'Spare room: up to 30.5 °C, above the range 22.0–27.0 °C.';
    await expect.poll(() => alert.textContent()).toContain(above);
    const waiting = page.getByText('Saved on this phone, waiting to send.');
    await waiting.waitFor();
    expect(await card.count()).toBe(0);
    // A reload with no signal keeps the reading and its notice, from the phone's own copy.
    await page.reload();
    await waiting.waitFor();
    await expect.poll(() => alert.textContent()).toContain(above);
    expect(await card.count()).toBe(0);
    expect(await typedOnServer()).toEqual([]);
    await expectAccessible(page, 'today with a reading waiting to send');
    await screenshot(page, 'climate-01-today-alert-offline');
    // The signal returns: sent once, and from then on the server's own.
    await restoreNetwork(context);
    await page.getByRole('button', { name: 'Sync now' }).click();
    await expect.poll(typedOnServer).toEqual([30.5]);
    await expect.poll(() => waiting.count()).toBe(0);
    await page.reload();
    await expect.poll(() => alert.textContent()).toContain(above);
    expect(await card.count()).toBe(0);
    expect(await typedOnServer()).toEqual([30.5]);

    // The first morning (07:00 in the collection's zone) after the reading.
    const zone = DEMO_COLLECTION.timeZone;
    const now = new Date();
    const today = localDateOf(now, zone);
    const morning =
      now < morningOf(today, zone) ? morningOf(today, zone) : morningOf(addDays(today, 1), zone);
    env.server.ctx.setNow(new Date(morning.getTime() + 5 * 60_000));
    try {
      expect(await env.server.ctx.services.dailyMail.runDue()).toBe(1);
    } finally {
      env.server.ctx.setNow(null);
    }
    await page.goto(`${env.server.baseUrl}/dev/mailbox`);
    await page.getByText('Northlight Inverts: a room was out of range').first().waitFor();
    await expect
      .poll(() =>
        page.getByText(/Spare room: up to 30\.5 °C, above the range 22\.0–27\.0 °C\./).count(),
      )
      .toBeGreaterThan(0);
    await expectAccessible(page, 'mailbox with the morning e-mail');
    await screenshot(page, 'climate-02-mailbox');

    // The range is kept on the Places screen, in the person's unit.
    await page.goto(`${env.server.baseUrl}/places`);
    const rooms = page.getByRole('list', { name: 'Rooms and their climate' });
    await rooms.getByText('22.0–27.0 °C · 60–75 %').waitFor();
    await rooms.getByRole('button', { name: 'Set range' }).click();
    const form = page.getByRole('form', { name: 'Target range for Spare room' });
    expect(await form.getByLabel('Highest (°C)').inputValue()).toBe('27');
    await form.scrollIntoViewIfNeeded();
    await expectAccessible(page, 'room range form');
    await screenshot(page, 'climate-04-places-range');
    expect(consoleErrors).toEqual([]);
    await context.close();
  }, 45_000);

  it('draws the room’s days with its range at 1280 px', async () => {
    const context = await env.browser.newContext({ viewport: { width: 1280, height: 900 } });
    const page = await context.newPage();
    await signInAsDemo(page, env.server.baseUrl, 'owner@northlight.test');
    await page.goto(`${env.server.baseUrl}/climate?room=Spare%20room`);
    await page.getByRole('table', { name: 'Each day’s lowest and highest' }).waitFor();
    // The seeded week has a day above the range (29.5 °C) in the table.
    await expect.poll(() => page.getByText('22.5 °C – 25.5 °C').count()).toBeGreaterThan(0);
    await page.locator('.recharts-reference-area').first().waitFor();
    await expectAccessible(page, 'room climate page');
    await screenshot(page, 'climate-03-room-1280');

    // An animal of the spare room has its room's days on its timeline, the hot day marked.
    const [animal] = await env.server.ctx.database.db
      .select({ id: animals.id })
      .from(animals)
      .where(eq(animals.name, 'Dusty'));
    await page.goto(`${env.server.baseUrl}/animals/${animal!.id}`);
    const days = page.getByRole('list', { name: 'Climate of Spare room, day by day' });
    await page.getByRole('button', { name: /Show all \d+ days/ }).click();
    await days.getByText(/23\.4–29\.5 °C · 64 % · out of range/).waitFor();
    await days.scrollIntoViewIfNeeded();
    await expectAccessible(page, 'animal timeline with its room');
    await screenshot(page, 'climate-05-animal-timeline-1280');
    await context.close();
  });
});
