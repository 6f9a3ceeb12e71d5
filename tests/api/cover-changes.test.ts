// An owner's cover after the invite: new days (checked, with readable refusals), the invite sent
// again with a new link, and the summary of the whole cover when it ends, early or on its own.
import { randomUUID } from 'node:crypto';
import { afterAll, afterEach, beforeAll, describe, expect, it } from 'vitest';
import { createAnimal, PASSWORD, signUp, type SignedUp } from '../factories';
import { createTestContext, type TestContext } from '../setup/test-app';

let ctx: TestContext;
let owner: SignedUp;
let juniper: string;
let bramble: string;

const base = () => `/api/collections/${owner.collectionId}`;
const tokenIn = (text: string) => /token=([A-Za-z0-9_-]+)/.exec(text)![1]!;

beforeAll(async () => {
  ctx = await createTestContext();
  owner = await signUp(ctx);
  juniper = (await createAnimal(ctx.database.db, owner.collectionId, { name: 'Juniper' })).id;
  bramble = (await createAnimal(ctx.database.db, owner.collectionId, { name: 'Bramble' })).id;
});
afterEach(() => ctx.setNow(null));
afterAll(async () => {
  await ctx.close();
});

async function invite(email: string, firstDay: string, lastDay: string) {
  const res = await owner.agent
    .post(`${base()}/covers`)
    .send({ email, firstDay, lastDay, message: 'Feeders in the blue tub.' })
    .expect(201);
  await ctx.services.background.drain();
  const mail = ctx.mailbox.messages.filter((m) => m.to.includes(email)).at(-1)!;
  return { id: res.body.id as string, token: tokenIn(mail.text) };
}

async function accept(token: string, displayName: string) {
  const helper = ctx.agent();
  await helper
    .post('/api/cover-invites/accept')
    .send({ token, account: { displayName, password: PASSWORD } })
    .expect(200);
  return helper;
}

const coverOf = async (id: string) =>
  ((await owner.agent.get(`${base()}/covers`).expect(200)).body.covers as { id: string }[]).find(
    (c) => c.id === id,
  ) as Record<string, unknown>;

describe('changing a cover’s days', () => {
  it('moves the days, and refuses an end before the start or days already over with a readable 422', async () => {
    ctx.setNow(new Date('2026-12-02T15:00:00Z'));
    const email = `days-${randomUUID().slice(0, 6)}@example.test`;
    const { id } = await invite(email, '2026-12-10', '2026-12-12');
    const moved = await owner.agent
      .put(`${base()}/covers/${id}`)
      .send({ firstDay: '2026-12-11', lastDay: '2026-12-16', message: 'New days.' })
      .expect(200);
    expect(moved.body.covers.find((c: { id: string }) => c.id === id)).toMatchObject({
      firstDay: '2026-12-11',
      lastDay: '2026-12-16',
      message: 'New days.',
      state: 'invited',
    });

    const backwards = await owner.agent
      .put(`${base()}/covers/${id}`)
      .send({ firstDay: '2026-12-16', lastDay: '2026-12-11', message: '' });
    expect(backwards.status).toBe(422);
    expect(JSON.stringify(backwards.body.error)).toContain(
      'The last day comes on or after the first day.',
    );
    const past = await owner.agent
      .put(`${base()}/covers/${id}`)
      .send({ firstDay: '2026-11-20', lastDay: '2026-11-25', message: '' });
    expect(past.status).toBe(422);
    expect(past.body.error.message).toBe(
      'That cover would already be over. Choose days from today on.',
    );
    const notADate = await owner.agent
      .put(`${base()}/covers/${id}`)
      .send({ firstDay: '11/12/2026', lastDay: '2026-12-16', message: '' });
    expect(notADate.status).toBe(422);
    expect(
      (
        await owner.agent
          .put(`${base()}/covers/${randomUUID()}`)
          .send({ firstDay: '2026-12-11', lastDay: '2026-12-16', message: '' })
      ).status,
    ).toBe(404);
    // Unchanged by the refusals.
    expect(await coverOf(id)).toMatchObject({ firstDay: '2026-12-11', lastDay: '2026-12-16' });
  });

  it('moves an accepted helper’s access with the days', async () => {
    ctx.setNow(new Date('2026-12-02T15:00:00Z'));
    const email = `move-${randomUUID().slice(0, 6)}@example.test`;
    const { id, token } = await invite(email, '2026-12-02', '2026-12-04');
    const helper = await accept(token, 'Mo');
    await helper.get(`${base()}/cover/mine`).expect(200);
    await owner.agent
      .put(`${base()}/covers/${id}`)
      .send({ firstDay: '2026-12-05', lastDay: '2026-12-06', message: '' })
      .expect(200);
    const before = await helper.get(`${base()}/cover/mine`);
    expect(before.status).toBe(403);
    expect(before.body.error.message).toMatch(/runs from Sat 5 Dec 2026 to Sun 6 Dec 2026/);
    expect(await coverOf(id)).toMatchObject({ state: 'upcoming' });
  });
});

describe('sending a cover’s invite again', () => {
  it('mails a new link (the old one stops working) until the helper accepts', async () => {
    ctx.setNow(new Date('2026-12-02T15:00:00Z'));
    const email = `resend-${randomUUID().slice(0, 6)}@example.test`;
    const { id, token } = await invite(email, '2026-12-20', '2026-12-24');
    // A week on the link has expired; the owner sends it again.
    ctx.setNow(new Date('2026-12-10T15:00:00Z'));
    expect(await coverOf(id)).toMatchObject({ inviteExpired: true, state: 'invited' });
    const resent = await owner.agent.post(`${base()}/covers/${id}/resend`).expect(202);
    expect(resent.body.covers.find((c: { id: string }) => c.id === id)).toMatchObject({
      inviteExpired: false,
    });
    await ctx.services.background.drain();
    const mails = ctx.mailbox.messages.filter((m) => m.to.includes(email));
    expect(mails).toHaveLength(2);
    expect(mails[1]!.text).toContain('from Sun 20 Dec 2026 to Thu 24 Dec 2026');
    const fresh = tokenIn(mails[1]!.text);
    expect(fresh).not.toBe(token);
    const old = await ctx.agent().get(`/api/cover-invites/preview?token=${token}`);
    expect(old.status).toBe(400);
    await accept(fresh, 'Rey');

    const again = await owner.agent.post(`${base()}/covers/${id}/resend`);
    expect(again.status).toBe(409);
    expect(again.body.error.message).toBe(
      'This cover was accepted already: there is no invite to send again.',
    );
    expect((await owner.agent.post(`${base()}/covers/${randomUUID()}/resend`)).status).toBe(404);
  });

  it('is refused for a cover that is over, and to a helper', async () => {
    ctx.setNow(new Date('2026-12-02T15:00:00Z'));
    const email = `over-${randomUUID().slice(0, 6)}@example.test`;
    const { id, token } = await invite(email, '2026-12-02', '2026-12-03');
    const helper = await accept(token, 'Helper');
    expect((await helper.post(`${base()}/covers/${id}/resend`)).status).toBe(403);
    ctx.setNow(new Date('2026-12-05T15:00:00Z'));
    const late = await owner.agent.post(`${base()}/covers/${id}/resend`);
    expect(late.status).toBe(409);
  });
});

describe('the summary when a cover ends', () => {
  it('arrives at once after an early end: fed, refused, noted, problems and handover notes, in the app and the mailbox', async () => {
    ctx.setNow(new Date('2026-12-02T15:00:00Z'));
    const email = `summary-${randomUUID().slice(0, 6)}@example.test`;
    await owner.agent
      .put(`${base()}/handover/general`)
      .send({ text: 'Feeders are in the blue tub.' })
      .expect(204);
    await owner.agent
      .post(`${base()}/handover/notes`)
      .send({
        animalId: bramble,
        text: 'In premolt: no food.',
        until: '2026-12-09',
        doNotFeed: true,
      })
      .expect(201);
    const { id, token } = await invite(email, '2026-12-02', '2026-12-09');
    const helper = await accept(token, 'Sam');
    const tap = (animalId: string, kind: string, at: string, payload = {}) => ({
      id: randomUUID(),
      animalId,
      kind,
      payload,
      clientRecordedAt: at,
    });
    ctx.setNow(new Date('2026-12-03T16:00:00Z'));
    await helper
      .post(`${base()}/events`)
      .send({
        deviceId: 'sam',
        clientSentAt: '2026-12-03T16:00:00Z',
        events: [
          tap(juniper, 'ate', '2026-12-03T15:00:00Z'),
          tap(bramble, 'refused', '2026-12-03T15:05:00Z'),
          tap(juniper, 'note', '2026-12-03T15:06:00Z', { text: 'Webbed over the water dish.' }),
        ],
      })
      .expect(200);
    await helper
      .post(`${base()}/helper-reports`)
      .send({ kind: 'escape', animalId: juniper, note: 'Lid was loose; back in now.' })
      .expect(201);
    await ctx.services.background.drain();

    ctx.setNow(new Date('2026-12-04T15:00:00Z'));
    expect(await coverOf(id)).toMatchObject({ hasSummary: false });
    const ended = await owner.agent.post(`${base()}/covers/${id}/end`).expect(200);
    expect(ended.body.covers.find((c: { id: string }) => c.id === id)).toMatchObject({
      state: 'ended',
      hasSummary: true,
    });
    // In the app at once.
    const reports = (await owner.agent.get(`${base()}/cover-reports`).expect(200)).body.reports;
    const summary = reports.find((r: { coverId: string | null }) => r.coverId === id);
    expect(summary.subject).toBe(
      'Test Collection: summary of Sam’s cover, Wed 2 Dec 2026 to Fri 4 Dec 2026',
    );
    expect(summary.body).toContain('- Ate: 1');
    expect(summary.body).toContain('- Refused: 1');
    expect(summary.body).toMatch(/Fed \(1\)\n- Juniper \([\w-]+\): Thu 3 Dec, 10:00 by Sam/);
    expect(summary.body).toMatch(/Refused \(1\)\n- Bramble/);
    expect(summary.body).toContain('Webbed over the water dish.');
    expect(summary.body).toMatch(
      /Problems reported \(1\)\n- .+ An animal got out — Juniper \([\w-]+\), by Sam: Lid was loose; back in now\./,
    );
    expect(summary.body).toContain('- For everything: Feeders are in the blue tub.');
    expect(summary.body).toMatch(
      /- Bramble \([\w-]+\), until Wed 9 Dec, do not feed: In premolt: no food\./,
    );

    // And by e-mail, once.
    await ctx.services.background.drain();
    const mailed = ctx.mailbox.messages.filter(
      (m) => m.to.includes(owner.email) && m.subject === summary.subject,
    );
    expect(mailed).toHaveLength(1);
    expect(mailed[0]!.text.trim()).toBe(summary.body);
    await ctx.services.coverReports.runDue();
    expect(
      ctx.mailbox.messages.filter(
        (m) => m.to.includes(owner.email) && m.subject === summary.subject,
      ),
    ).toHaveLength(1);

    // Ending twice is refused; the helper cannot end it.
    const twice = await owner.agent.post(`${base()}/covers/${id}/end`);
    expect(twice.status).toBe(409);
    expect(twice.body.error.message).toBe('This cover has ended already.');
  });

  it('is made by the report job when a cover runs to its end, and not for a cover that never began', async () => {
    const keeper = await signUp(ctx);
    const kb = `/api/collections/${keeper.collectionId}`;
    ctx.setNow(new Date('2026-12-02T15:00:00Z'));
    const email = `natural-${randomUUID().slice(0, 6)}@example.test`;
    const res = await keeper.agent
      .post(`${kb}/covers`)
      .send({ email, firstDay: '2026-12-02', lastDay: '2026-12-03', message: '' })
      .expect(201);
    await ctx.services.background.drain();
    await accept(
      tokenIn(ctx.mailbox.messages.filter((m) => m.to.includes(email)).at(-1)!.text),
      'Ann',
    );
    // Another accepted cover, ended by the owner before it began: nothing to sum up.
    const early = `early-${randomUUID().slice(0, 6)}@example.test`;
    const never = await keeper.agent
      .post(`${kb}/covers`)
      .send({ email: early, firstDay: '2026-12-20', lastDay: '2026-12-21', message: '' })
      .expect(201);
    await ctx.services.background.drain();
    await accept(
      tokenIn(ctx.mailbox.messages.filter((m) => m.to.includes(early)).at(-1)!.text),
      'Bo',
    );
    await keeper.agent.post(`${kb}/covers/${never.body.id}/end`).expect(200);

    // Toronto: the cover's last day ends at 05:00Z on 4 Dec.
    ctx.setNow(new Date('2026-12-04T04:59:00Z'));
    await ctx.services.coverReports.runDue();
    const summaries = async () =>
      (await keeper.agent.get(`${kb}/cover-reports`).expect(200)).body.reports.filter(
        (r: { coverId: string | null }) => r.coverId,
      );
    expect(await summaries()).toHaveLength(0);
    ctx.setNow(new Date('2026-12-04T05:10:00Z'));
    // The last day's report and the summary (other tests' covers in this file may go too).
    await ctx.services.coverReports.runDue();
    const listed = (await keeper.agent.get(`${kb}/cover-reports`).expect(200)).body.reports;
    expect(
      listed.map((r: { localDate: string; coverId: string | null }) => [r.localDate, !!r.coverId]),
    ).toEqual([
      ['2026-12-03', true],
      ['2026-12-03', false],
      ['2026-12-02', false],
    ]);
    const [made] = await summaries();
    expect(made).toMatchObject({ coverId: res.body.id, localDate: '2026-12-03' });
    expect(made.body).toContain('- Nothing was recorded during the cover.');
    expect(made.body).toContain('No problems were reported.');
    const mail = await ctx.mailbox.waitFor(
      (m) => m.to.includes(keeper.email) && m.subject.includes('summary of Ann’s cover'),
    );
    expect(mail.subject).toBe(
      'Test Collection: summary of Ann’s cover, Wed 2 Dec 2026 to Thu 3 Dec 2026',
    );
    expect(await ctx.services.coverReports.runDue()).toBe(0);
    expect(
      ctx.mailbox.messages.filter(
        (m) => m.to.includes(keeper.email) && m.subject.includes('summary'),
      ),
    ).toHaveLength(1);
  });
});
