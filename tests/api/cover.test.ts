import { randomUUID } from 'node:crypto';
import { afterAll, afterEach, beforeAll, describe, expect, it } from 'vitest';
import { createAnimal, PASSWORD, signUp, type SignedUp } from '../factories';
import { createTestContext, type TestContext } from '../setup/test-app';

let ctx: TestContext;
let owner: SignedUp;
let other: SignedUp;
let animalId: string;
let otherAnimalId: string;

const base = (who: SignedUp = owner) => `/api/collections/${who.collectionId}`;
const tokenIn = (text: string) => /token=([A-Za-z0-9_-]+)/.exec(text)![1]!;

// Instants around the cover, checked against ICU's time-zone data (Intl) rather than our own code:
// America/Toronto is UTC−5 in winter.
const zoneClock = (iso: string) =>
  new Intl.DateTimeFormat('en-CA', {
    timeZone: 'America/Toronto',
    year: 'numeric',
    month: '2-digit',
    day: '2-digit',
    hour: '2-digit',
    minute: '2-digit',
    hourCycle: 'h23',
  }).format(new Date(iso));

beforeAll(async () => {
  ctx = await createTestContext();
  owner = await signUp(ctx);
  other = await signUp(ctx);
  animalId = (
    await createAnimal(ctx.database.db, owner.collectionId, {
      name: 'Juniper',
      cautions: ['urticating_hairs'],
      hasWaterDish: true,
    })
  ).id;
  otherAnimalId = (await createAnimal(ctx.database.db, other.collectionId, { name: 'Elsewhere' }))
    .id;
});
afterEach(() => ctx.setNow(null));
afterAll(async () => {
  await ctx.close();
});

async function invite(
  email: string,
  firstDay: string,
  lastDay: string,
  message = 'Feeders are in the blue tub. Call me on 555-0100.',
) {
  await owner.agent
    .post(`${base()}/covers`)
    .send({ email, firstDay, lastDay, message })
    .expect(201);
  const mail = await ctx.mailbox.waitFor(
    (m) => m.to.includes(email) && m.subject.includes('cover the feeds'),
  );
  return { mail, token: tokenIn(mail.text) };
}

describe('a cover from invite to access', () => {
  it('mails a single-use link that makes an account and a helper for exactly those days', async () => {
    ctx.setNow(new Date('2026-12-08T15:00:00Z'));
    const email = `sitter-${randomUUID().slice(0, 6)}@example.test`;
    const { mail, token } = await invite(email, '2026-12-10', '2026-12-16');
    expect(mail.text).toContain('from Thu 10 Dec 2026 to Wed 16 Dec 2026');
    expect(mail.text).toContain('Feeders are in the blue tub.');
    expect(mail.text).toContain('http://rackside.test/cover/accept?token=');

    const sitter = ctx.agent();
    const preview = await sitter.get(`/api/cover-invites/preview?token=${token}`).expect(200);
    expect(preview.body).toMatchObject({
      email,
      firstDay: '2026-12-10',
      lastDay: '2026-12-16',
      hasAccount: false,
    });
    expect((await sitter.post('/api/cover-invites/accept').send({ token })).status).toBe(422);
    const accepted = await sitter
      .post('/api/cover-invites/accept')
      .send({ token, account: { displayName: 'Sam', password: PASSWORD } })
      .expect(200);
    const membership = accepted.body.me.memberships.find(
      (m: { collectionId: string }) => m.collectionId === owner.collectionId,
    );
    // 00:00 in Toronto on the 10th to 00:00 on the 17th (EST, UTC−5).
    expect(membership).toMatchObject({
      role: 'helper',
      startsAt: '2026-12-10T05:00:00.000Z',
      endsAt: '2026-12-17T05:00:00.000Z',
    });
    expect(zoneClock(membership.startsAt)).toBe('2026-12-10, 00:00');

    // The link works once.
    const again = await ctx
      .agent()
      .post('/api/cover-invites/accept')
      .send({ token, account: { displayName: 'Eve', password: PASSWORD } });
    expect(again.status).toBe(400);
    expect(again.body.error.message).toMatch(/already used/);

    // Before the window: a plain message saying when the cover runs.
    const early = await sitter.get(`${base()}/rounds/today`);
    expect(early.status).toBe(403);
    expect(early.body.error.message).toBe(
      'Your cover for Test Collection runs from Thu 10 Dec 2026 to Wed 16 Dec 2026.',
    );
    ctx.setNow(new Date('2026-12-12T15:00:00Z'));
    await sitter.get(`${base()}/rounds/today`).expect(200);
    ctx.setNow(new Date('2026-12-17T05:00:00Z'));
    expect((await sitter.get(`${base()}/rounds/today`)).body.error.message).toBe(
      'Your cover for Test Collection ended on Wed 16 Dec 2026. Thank you!',
    );
  });

  it('refuses an expired link, and asks an existing account to sign in as the invited e-mail', async () => {
    ctx.setNow(new Date('2026-12-01T15:00:00Z'));
    const known = await signUp(ctx);
    const { token } = await invite(known.email, '2026-12-20', '2026-12-27');
    expect((await ctx.agent().post('/api/cover-invites/accept').send({ token })).status).toBe(401);
    expect(
      (await other.agent.post('/api/cover-invites/accept').send({ token })).body.error.message,
    ).toBe(`Sign in as ${known.email} to accept this cover.`);
    // A week later the link has expired (INVITE_LIFETIME_MS).
    ctx.setNow(new Date('2026-12-08T15:00:01Z'));
    const late = await known.agent.post('/api/cover-invites/accept').send({ token });
    expect(late.status).toBe(400);
    expect(late.body.error.message).toMatch(/expired/);
    expect(
      (await ctx.agent().get('/api/cover-invites/preview?token=not-a-real-token-at-all-xx')).status,
    ).toBe(400);
  });

  it('lets the owner change and end a cover, and the helper leave one', async () => {
    ctx.setNow(new Date('2026-12-02T15:00:00Z'));
    const email = `friend-${randomUUID().slice(0, 6)}@example.test`;
    const { token } = await invite(email, '2026-12-02', '2026-12-05');
    const friend = ctx.agent();
    await friend
      .post('/api/cover-invites/accept')
      .send({ token, account: { displayName: 'Friend', password: PASSWORD } })
      .expect(200);
    const list = (await owner.agent.get(`${base()}/covers`).expect(200)).body.covers;
    const cover = list.find((c: { email: string }) => c.email === email);
    expect(cover).toMatchObject({
      state: 'running',
      helperName: 'Friend',
      firstDay: '2026-12-02',
      lastDay: '2026-12-05',
    });
    await friend.get(`${base()}/cover/mine`).expect(200);
    await owner.agent
      .put(`${base()}/covers/${cover.id}`)
      .send({ firstDay: '2026-12-03', lastDay: '2026-12-05', message: '' })
      .expect(200);
    expect((await friend.get(`${base()}/cover/mine`)).status).toBe(403);
    await owner.agent
      .put(`${base()}/covers/${cover.id}`)
      .send({ firstDay: '2026-12-02', lastDay: '2026-12-05', message: '' })
      .expect(200);
    await owner.agent.post(`${base()}/covers/${cover.id}/end`).expect(200);
    expect((await friend.get(`${base()}/cover/mine`)).status).toBe(403);
    await friend.delete(`${base()}/cover/mine`).expect(204);
    expect((await friend.get(`${base()}/cover/mine`)).status).toBe(404);
  });
});

describe('ending a cover early', () => {
  it('ends the helper’s write access at once: taps still on their phone are refused, not kept for a grace', async () => {
    ctx.setNow(new Date('2026-12-02T15:00:00Z'));
    const email = `early-${randomUUID().slice(0, 6)}@example.test`;
    const { token } = await invite(email, '2026-12-02', '2026-12-09');
    const helper = ctx.agent();
    await helper
      .post('/api/cover-invites/accept')
      .send({ token, account: { displayName: 'Early', password: PASSWORD } })
      .expect(200);
    const tapAt = (iso: string) => ({
      id: randomUUID(),
      animalId,
      kind: 'watered',
      payload: {},
      clientRecordedAt: iso,
    });
    const sync = (events: unknown[], sentAt: string) =>
      helper
        .post(`${base()}/events`)
        .send({ deviceId: 'early', clientSentAt: sentAt, events })
        .expect(200);

    ctx.setNow(new Date('2026-12-04T15:00:00Z'));
    const before = tapAt('2026-12-04T14:00:00.000Z');
    expect((await sync([before], '2026-12-04T15:00:00.000Z')).body.results[0].status).toBe(
      'accepted',
    );
    const cover = (await owner.agent.get(`${base()}/covers`).expect(200)).body.covers.find(
      (c: { email: string }) => c.email === email,
    );
    await owner.agent.post(`${base()}/covers/${cover.id}/end`).expect(200);

    // A minute later the phone delivers a tap made before the end: no grace after an early end.
    ctx.setNow(new Date('2026-12-04T15:01:00Z'));
    const offline = tapAt('2026-12-04T14:30:00.000Z');
    const res = await sync([offline, before], '2026-12-04T15:01:00.000Z');
    expect(res.body.results[0]).toMatchObject({ status: 'rejected', reason: 'outside_cover' });
    expect(res.body.results[0].message).toBe(
      'Your cover for Test Collection was ended on Fri 4 Dec 2026; taps that had not reached Rackside by then cannot be saved. Tell the keeper what you did.',
    );
    // What was saved before the end stays saved: the phone hears "duplicate", never a refusal.
    expect(res.body.results[1]).toEqual({ id: before.id, status: 'duplicate' });
    expect((await helper.get(`${base()}/rounds/today`)).status).toBe(403);

    // New days from the owner are a new grant: writes open again inside them.
    await owner.agent
      .put(`${base()}/covers/${cover.id}`)
      .send({ firstDay: '2026-12-04', lastDay: '2026-12-09', message: '' })
      .expect(200);
    const reopened = tapAt('2026-12-04T15:00:30.000Z');
    expect((await sync([reopened], '2026-12-04T15:01:00.000Z')).body.results[0].status).toBe(
      'accepted',
    );
  });
});

// What a helper may call before, during and after the window: tests/api/authorisation-matrix.test.ts.

describe('handover notes and the helper’s view', () => {
  it('shows the general note, per-animal notes until their date and 14 days of facts; "do not feed" holds the feed', async () => {
    ctx.setNow(new Date('2026-12-01T15:00:00Z'));
    await owner.agent
      .put(`${base()}/handover/general`)
      .send({ text: 'Feeders: blue tub. Escape: close the door, check under the rack.' })
      .expect(204);
    // A new animal is due its first meal today; a "do not feed" note until the 5th holds it.
    const fresh = (await createAnimal(ctx.database.db, owner.collectionId, { name: 'Premolt' })).id;
    const schedule = async () =>
      (await owner.agent.get(`${base()}/animals/${fresh}/schedule`).expect(200)).body;
    expect((await schedule()).tasks.map((t: { kind: string }) => t.kind)).toContain('feed');
    await owner.agent
      .post(`${base()}/handover/notes`)
      .send({
        animalId: fresh,
        text: 'In premolt: no food, water only.',
        until: '2026-12-05',
        doNotFeed: true,
      })
      .expect(201);
    const held = await schedule();
    expect(held.tasks.map((t: { kind: string }) => t.kind)).not.toContain('feed');
    expect(held.nextFeed).toBe('2026-12-06');
    expect(
      (
        await owner.agent
          .post(`${base()}/handover/notes`)
          .send({ animalId: otherAnimalId, text: 'x', until: '2026-12-05' })
      ).status,
    ).toBe(404);

    const email = `view-${randomUUID().slice(0, 6)}@example.test`;
    const { token } = await invite(email, '2026-12-01', '2026-12-03');
    const helper = ctx.agent();
    await helper
      .post('/api/cover-invites/accept')
      .send({ token, account: { displayName: 'Viewer', password: PASSWORD } })
      .expect(200);
    await owner.agent
      .post(`${base()}/events`)
      .send({
        deviceId: 'd',
        clientSentAt: new Date().toISOString(),
        events: [
          {
            id: randomUUID(),
            animalId,
            kind: 'watered',
            payload: {},
            clientRecordedAt: '2026-12-01T14:00:00Z',
          },
        ],
      })
      .expect(200);
    const view = (await helper.get(`${base()}/cover/mine`).expect(200)).body;
    expect(view).toMatchObject({
      firstDay: '2026-12-01',
      lastDay: '2026-12-03',
      generalNote: 'Feeders: blue tub. Escape: close the door, check under the rack.',
      safetyAcknowledgedAt: null,
    });
    expect(view.recent[animalId]).toEqual(
      expect.arrayContaining([expect.objectContaining({ kind: 'watered', by: 'Test Keeper' })]),
    );
    await helper.post(`${base()}/cover/mine/acknowledge`).expect(204);
    expect((await helper.get(`${base()}/cover/mine`)).body.safetyAcknowledgedAt).toBe(
      '2026-12-01T15:00:00.000Z',
    );
  });
});

describe('the daily report', () => {
  it('goes out when each covered day ends in Toronto, across the March 2027 clock change', async () => {
    // DST starts Sunday 14 March 2027 at 02:00 in Toronto: that day has 23 hours.
    expect(zoneClock('2027-03-14T04:59:00Z')).toBe('2027-03-13, 23:59');
    expect(zoneClock('2027-03-14T05:00:00Z')).toBe('2027-03-14, 00:00');
    expect(zoneClock('2027-03-15T03:59:00Z')).toBe('2027-03-14, 23:59');
    expect(zoneClock('2027-03-15T04:00:00Z')).toBe('2027-03-15, 00:00');

    const keeper = await signUp(ctx);
    const spider = (await createAnimal(ctx.database.db, keeper.collectionId, { name: 'Ember' })).id;
    // Due its first meal and never fed: the report says so.
    await createAnimal(ctx.database.db, keeper.collectionId, { name: 'Tiger' });
    ctx.setNow(new Date('2027-03-10T15:00:00Z'));
    const email = `dst-${randomUUID().slice(0, 6)}@example.test`;
    await keeper.agent
      .post(`/api/collections/${keeper.collectionId}/covers`)
      .send({ email, firstDay: '2027-03-13', lastDay: '2027-03-14', message: '' })
      .expect(201);
    const token = tokenIn((await ctx.mailbox.waitFor((m) => m.to.includes(email))).text);
    const helper = ctx.agent();
    await helper
      .post('/api/cover-invites/accept')
      .send({ token, account: { displayName: 'Dana', password: PASSWORD } })
      .expect(200);

    ctx.setNow(new Date('2027-03-13T16:00:00Z'));
    const tap = (kind: string, at: string, payload = {}) => ({
      id: randomUUID(),
      animalId: spider,
      kind,
      payload,
      clientRecordedAt: at,
    });
    await helper
      .post(`/api/collections/${keeper.collectionId}/events`)
      .send({
        deviceId: 'h',
        clientSentAt: '2027-03-13T16:00:00Z',
        events: [
          tap('ate', '2027-03-13T15:30:00Z'),
          tap('note', '2027-03-13T15:31:00Z', { text: 'Webbed over the water dish.' }),
        ],
      })
      .expect(200);

    const reports = ctx.services.coverReports;
    const mine = () =>
      ctx.mailbox.messages.filter(
        (m) => m.to.includes(keeper.email) && m.subject.includes('cover report'),
      );
    ctx.setNow(new Date('2027-03-14T04:59:00Z'));
    expect(await reports.runDue()).toBe(0);
    ctx.setNow(new Date('2027-03-14T05:00:00Z'));
    expect(await reports.runDue()).toBe(1);
    expect(await reports.runDue()).toBe(0); // once only
    const first = await ctx.mailbox.waitFor(
      (m) => m.to.includes(keeper.email) && m.subject.includes('Sat 13 Mar 2027'),
    );
    expect(first.text).toContain('Fed (1)');
    expect(first.text).toContain('10:30 Ember');
    expect(first.text).toContain('by Dana');
    expect(first.text).toContain('Notes (1)');
    expect(first.text).toContain('Webbed over the water dish.');
    expect(first.text).toMatch(/Needs attention\n- Not done: Tiger \(TS-\w+\) — feed/);

    // The 23-hour day ends at 04:00Z, not 05:00Z.
    ctx.setNow(new Date('2027-03-15T03:59:00Z'));
    expect(await reports.runDue()).toBe(0);
    ctx.setNow(new Date('2027-03-15T04:00:00Z'));
    // The last day's report, and the summary of the whole cover (tests/api/cover-changes.test.ts).
    expect(await reports.runDue()).toBe(2);
    const last = await ctx.mailbox.waitFor(
      (m) => m.to.includes(keeper.email) && m.subject.includes('Sun 14 Mar 2027 (last day)'),
    );
    expect(last.text).toContain('Nothing was recorded this day.');
    expect(last.text).toContain('The summary of the whole cover comes in its own e-mail.');
    const summary = await ctx.mailbox.waitFor(
      (m) => m.to.includes(keeper.email) && m.subject.includes('summary of Dana’s cover'),
    );
    expect(summary.subject).toContain('Sat 13 Mar 2027 to Sun 14 Mar 2027');
    expect(summary.text).toMatch(/In numbers\n- Ate: 1\n- Note: 1/);
    expect(mine()).toHaveLength(2);
    const listed = (
      await keeper.agent.get(`/api/collections/${keeper.collectionId}/cover-reports`).expect(200)
    ).body.reports;
    expect(listed.map((r: { localDate: string }) => r.localDate)).toEqual([
      '2027-03-14',
      '2027-03-14',
      '2027-03-13',
    ]);
  });
});
