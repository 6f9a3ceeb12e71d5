// An owner deletes a collection at 360 px: the backup is offered first, the name must be typed
// out before the button works, and afterwards the app says there is no collection left.
import { eq } from 'drizzle-orm';
import { describe, expect, it } from 'vitest';
import { collections } from '../../server/db/schema/collections';
import { createAnimal, PASSWORD, signUp } from '../factories';
import { expectAccessible, phonePage, screenshot, useE2e } from './support';

const env = useE2e();

describe('deleting a collection at 360 px', () => {
  it('offers the backup, asks for the name, and removes the collection', async () => {
    const owner = await signUp(env.server.ctx);
    await createAnimal(env.server.ctx.database.db, owner.collectionId, { name: 'Soon gone' });
    const { page, consoleErrors } = await phonePage(env.browser);
    await page.goto(`${env.server.baseUrl}/sign-in`);
    await page.getByLabel('E-mail').fill(owner.email);
    await page.getByLabel('Password').fill(PASSWORD);
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.waitForURL('**/today');
    await page.getByRole('link', { name: 'Settings' }).click();
    await page.getByRole('button', { name: 'Delete this collection…' }).click();

    // Step 1: the backup, offered before anything else, downloads.
    const download = page.waitForEvent('download');
    await page.getByRole('link', { name: /Download its full backup/ }).click();
    expect((await download).suggestedFilename()).toMatch(
      /^rackside-backup-\d{4}-\d{2}-\d{2}\.json$/,
    );

    // Step 2: the button waits for the name, typed exactly.
    const confirm = page.getByRole('button', { name: 'Delete for everyone' });
    await expect.poll(() => confirm.isDisabled()).toBe(true);
    await page.getByLabel('2. Type “Test Collection” to confirm').fill('Test collection');
    await expect.poll(() => confirm.isDisabled()).toBe(true);
    await page.getByLabel('2. Type “Test Collection” to confirm').fill('Test Collection');
    await expect.poll(() => confirm.isDisabled()).toBe(false);
    await expectAccessible(page, 'delete collection');
    await screenshot(page, 'delete-collection-01-confirm');
    // Nothing scrolls sideways at 360 px.
    expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(
      360,
    );

    await confirm.click();
    await page.waitForURL('**/today');
    await expect.poll(() => page.getByText('You are not in any collection yet.').count()).toBe(1);
    await screenshot(page, 'delete-collection-02-after');
    expect(
      await env.server.ctx.database.db
        .select()
        .from(collections)
        .where(eq(collections.id, owner.collectionId)),
    ).toEqual([]);
    // A query still mounted when the collection went may ask once more for its data: the
    // answer is 404, as it should be; anything else is an error.
    expect(consoleErrors.filter((e) => !/status of 404/.test(e))).toEqual([]);
  });
});
