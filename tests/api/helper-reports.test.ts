// A helper covering the feeds reports an escape, a bite, a death or a note: it is stored at
// once, every owner gets it by e-mail after the answer, and the owners read it in the app.
// Outside the cover the helper is refused; bad input gets a sentence, not a 500.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { addMember, createAnimal, signUp, type SignedUp } from '../factories';
import { createTestContext, type TestContext } from '../setup/test-app';

let ctx: TestContext;
let owner: SignedUp;
let helper: SignedUp;
let lateHelper: SignedUp;
let keeper: SignedUp;
let animalId: string;

const base = () => `/api/collections/${owner.collectionId}/helper-reports`;
const DAY = 86_400_000;

beforeAll(async () => {
  ctx = await createTestContext();
  owner = await signUp(ctx);
  helper = await signUp(ctx);
  lateHelper = await signUp(ctx);
  keeper = await signUp(ctx);
  const db = ctx.database.db;
  await addMember(db, {
    collectionId: owner.collectionId,
    userId: helper.userId,
    role: 'helper',
    startsAt: new Date(Date.now() - DAY),
    endsAt: new Date(Date.now() + DAY),
  });
  // A cover that ended yesterday.
  await addMember(db, {
    collectionId: owner.collectionId,
    userId: lateHelper.userId,
    role: 'helper',
    startsAt: new Date(Date.now() - 3 * DAY),
    endsAt: new Date(Date.now() - DAY),
  });
  await addMember(db, { collectionId: owner.collectionId, userId: keeper.userId, role: 'keeper' });
  animalId = (await createAnimal(db, owner.collectionId, { name: 'Pepper' })).id;
});
afterAll(async () => {
  await ctx.close();
});

describe('a helper reports a problem', () => {
  it('is stored, mailed to the owner and listed for them', async () => {
    const sent = await helper.agent
      .post(base())
      .send({ kind: 'escape', animalId, note: '  Lid was open this morning. ' })
      .expect(201);
    expect(sent.body).toEqual({ id: expect.any(String) });
    await ctx.services.background.drain();
    const mail = await ctx.mailbox.waitFor(
      (m) => m.to.includes(owner.email) && m.subject.includes('reports an escape'),
    );
    expect(mail.text).toContain('Pepper');
    expect(mail.text).toContain('Lid was open this morning.');
    const listed = (await owner.agent.get(base()).expect(200)).body.reports;
    expect(listed[0]).toMatchObject({
      id: sent.body.id,
      kind: 'escape',
      animal: { id: animalId, name: 'Pepper' },
      note: 'Lid was open this morning.',
      reportedBy: 'Test Keeper',
    });
  });

  it('takes a note about an animal off the round, or about none', async () => {
    await helper.agent
      .post(base())
      .send({ kind: 'note', animalText: 'B-07', note: 'Water dish in B-07 is cracked.' })
      .expect(201);
    await helper.agent
      .post(base())
      .send({ kind: 'other', note: 'Heater in the shed trips the fuse.' })
      .expect(201);
    await ctx.services.background.drain();
    const listed = (await owner.agent.get(base()).expect(200)).body.reports as {
      kind: string;
      animal: unknown;
      animalText: string;
    }[];
    expect(listed.find((r) => r.kind === 'note')).toMatchObject({
      animal: null,
      animalText: 'B-07',
    });
    expect(listed.find((r) => r.kind === 'other')).toMatchObject({ animal: null, animalText: '' });
    await ctx.mailbox.waitFor(
      (m) => m.to.includes(owner.email) && m.subject.includes('reports a note'),
    );
  });

  it('is refused outside the cover, and the owners list is theirs only', async () => {
    const late = await lateHelper.agent
      .post(base())
      .send({ kind: 'death', note: 'Found it this morning.' })
      .expect(403);
    expect(late.body.error.message).toMatch(/cover/i);
    await helper.agent.get(base()).expect(403);
    await keeper.agent.get(base()).expect(403);
    const outsider = await signUp(ctx);
    await outsider.agent.post(base()).send({ kind: 'other', note: 'Hello' }).expect(404);
  });

  it('gives readable 4xx answers for bad input', async () => {
    const noKind = await helper.agent.post(base()).send({ note: 'Something' }).expect(422);
    expect(JSON.stringify(noKind.body)).toContain('Choose what happened.');
    const noNote = await helper.agent.post(base()).send({ kind: 'escape', note: '  ' }).expect(422);
    expect(JSON.stringify(noNote.body)).toContain('Say in a few words what happened.');
    const long = await helper.agent
      .post(base())
      .send({ kind: 'other', note: 'x'.repeat(1001) })
      .expect(422);
    expect(JSON.stringify(long.body)).toContain('under 1000 characters');
    await helper.agent
      .post(base())
      .send({ kind: 'bite_or_sting', animalId: 'nope', note: 'x' })
      .expect(422);
    // An animal of another collection is not found, and nothing is stored.
    const elsewhere = await signUp(ctx);
    const theirs = await createAnimal(ctx.database.db, elsewhere.collectionId, { name: 'Theirs' });
    const before = (await owner.agent.get(base()).expect(200)).body.reports.length;
    await helper.agent
      .post(base())
      .send({ kind: 'death', animalId: theirs.id, note: 'x' })
      .expect(404);
    expect((await owner.agent.get(base()).expect(200)).body.reports).toHaveLength(before);
  });
});
