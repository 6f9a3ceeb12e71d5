// A daily cover report counts as sent only once the mail server has accepted it, for each
// owner; otherwise the next run sends it again, to the owners still waiting for it only.
// The mail server is a real SMTP server (smtp-server) that refuses one recipient for a while.
import { eq } from 'drizzle-orm';
import { SMTPServer } from 'smtp-server';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { coverReports, memberships } from '../../server/db/schema/collections';
import { createCoverReportsService } from '../../server/features/cover/cover-reports.service';
import { createHelperReportsService } from '../../server/features/helper-reports/helper-reports.service';
import { createSmtpMailer, type Mailer } from '../../server/mail/mailer';
import { addMember, signUp, type SignedUp } from '../factories';
import { createTestContext, type TestContext } from '../setup/test-app';

let ctx: TestContext;
let smtp: SMTPServer;
let mailer: Mailer;
let owner: SignedUp;
let coOwner: SignedUp;
/** Recipients the server refuses (SMTP 450, "mailbox unavailable", RFC 5321 4.2.3). */
const refused = new Set<string>();
const accepted: { to: string; subject: string }[] = [];
let clock = new Date('2027-05-01T12:00:00Z');

beforeAll(async () => {
  ctx = await createTestContext();
  smtp = new SMTPServer({
    authOptional: true,
    disabledCommands: ['STARTTLS', 'AUTH'],
    logger: false,
    onRcptTo(address, _session, callback) {
      if (refused.has(address.address))
        return callback(
          Object.assign(new Error('Mailbox busy, try again later'), { responseCode: 450 }),
        );
      callback();
    },
    onData(stream, session, callback) {
      let raw = '';
      stream.on('data', (chunk: Buffer) => (raw += chunk.toString()));
      stream.on('end', () => {
        const subject = /^Subject: (.*)$/m.exec(raw)?.[1] ?? '';
        for (const r of session.envelope.rcptTo) accepted.push({ to: r.address, subject });
        callback();
      });
    },
  });
  await new Promise<void>((resolve) => smtp.listen(0, '127.0.0.1', resolve));
  mailer = createSmtpMailer(
    `smtp://127.0.0.1:${(smtp.server.address() as { port: number }).port}`,
    'Rackside tests <tests@rackside.invalid>',
  );

  owner = await signUp(ctx, { timeZone: 'UTC' });
  coOwner = await signUp(ctx, { timeZone: 'UTC' });
  await ctx.database.db
    .insert(memberships)
    .values({ collectionId: owner.collectionId, userId: coOwner.userId, role: 'owner' });
  const helper = await signUp(ctx, { timeZone: 'UTC' });
  // Covers 10 and 11 May 2027 in UTC.
  await addMember(ctx.database.db, {
    collectionId: owner.collectionId,
    userId: helper.userId,
    role: 'helper',
    startsAt: new Date('2027-05-10T00:00:00Z'),
    endsAt: new Date('2027-05-12T00:00:00Z'),
  });
});

afterAll(async () => {
  mailer.close();
  await new Promise<void>((resolve) => smtp.close(() => resolve()));
  await ctx.close();
});

describe('cover report delivery', () => {
  it('keeps a report the mail server refused unsent, and sends it on the next run to whoever still lacks it', async () => {
    const reports = createCoverReportsService(ctx.database.db, {
      mailer,
      now: () => clock,
      rounds: ctx.services.rounds,
      publicUrl: (p) => `http://rackside.test${p}`,
    });
    const row = async () =>
      (
        await ctx.database.db
          .select()
          .from(coverReports)
          .where(eq(coverReports.collectionId, owner.collectionId))
      )[0]!;
    const to = (email: string) => accepted.filter((m) => m.to === email).length;

    // 10 May has ended; the co-owner's mailbox is refusing mail.
    refused.add(coOwner.email);
    clock = new Date('2027-05-11T00:30:00Z');
    expect(await reports.runDue()).toBe(0);
    expect(to(owner.email)).toBe(1);
    expect(to(coOwner.email)).toBe(0);
    const waiting = await row();
    expect(waiting.subject).toMatch(/cover report for \w+ 10 May 2027/);
    expect(waiting.sentAt).toBeNull();
    expect(waiting.sentTo).toEqual([owner.email]);
    // Still refused ten minutes later: still unsent, and the first owner gets no second copy.
    clock = new Date('2027-05-11T00:40:00Z');
    expect(await reports.runDue()).toBe(0);
    expect((await row()).sentAt).toBeNull();
    expect(to(owner.email)).toBe(1);

    // The mailbox is back: the next run sends it to the co-owner only, and marks it sent.
    refused.clear();
    clock = new Date('2027-05-11T00:50:00Z');
    expect(await reports.runDue()).toBe(1);
    expect(to(coOwner.email)).toBe(1);
    expect(to(owner.email)).toBe(1);
    expect((await row()).sentAt).toEqual(clock);
    // And never again.
    clock = new Date('2027-05-11T01:00:00Z');
    expect(await reports.runDue()).toBe(0);
    expect(accepted.filter((m) => m.subject.includes('10 May 2027'))).toHaveLength(2);
  });

  it('gives up e-mailing after a week; the report stays in the app', async () => {
    const reports = createCoverReportsService(ctx.database.db, {
      mailer,
      now: () => clock,
      rounds: ctx.services.rounds,
      publicUrl: (p) => `http://rackside.test${p}`,
    });
    refused.add(owner.email);
    refused.add(coOwner.email);
    // 11 May (the last day) ends at midnight; its report is made and refused.
    clock = new Date('2027-05-12T00:10:00Z');
    expect(await reports.runDue()).toBe(0);
    refused.clear();
    clock = new Date('2027-05-19T00:11:00Z');
    expect(await reports.runDue()).toBe(0);
    expect(accepted.filter((m) => m.subject.includes('11 May 2027'))).toHaveLength(0);
    const listed = await reports.list(owner.collectionId);
    expect(listed.map((r) => r.localDate)).toEqual(['2027-05-11', '2027-05-10']);
  });

  it('sends a helper’s report to each owner once, retrying those the mail server refused', async () => {
    const tasks: Promise<void>[] = [];
    const helperReports = createHelperReportsService(ctx.database.db, {
      mailer,
      now: () => clock,
      publicUrl: (p) => `http://rackside.test${p}`,
      background: { run: (_task, work) => void tasks.push(work()), drain: async () => {} },
    });
    const about = (email: string) =>
      accepted.filter((m) => m.to === email && m.subject.includes('reports an escape')).length;
    refused.add(coOwner.email);
    clock = new Date('2027-05-10T15:00:00Z');
    await helperReports.report(
      { collectionId: owner.collectionId, collectionName: 'Test Collection', timeZone: 'UTC' },
      owner.userId,
      { kind: 'escape', animalId: null, animalText: 'C-3', note: 'Lid open.' },
    );
    await Promise.all(tasks);
    expect(about(owner.email)).toBe(1);
    expect(about(coOwner.email)).toBe(0);
    // The mailbox is back: the job's run sends it to the co-owner only, then never again.
    refused.clear();
    clock = new Date('2027-05-10T15:10:00Z');
    expect(await helperReports.deliverDue()).toBe(1);
    expect(await helperReports.deliverDue()).toBe(0);
    expect(about(owner.email)).toBe(1);
    expect(about(coOwner.email)).toBe(1);
  });
});
