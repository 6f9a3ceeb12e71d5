import supertest from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createAnimal, PASSWORD, sessionCookie, signUp } from '../factories';
import { createTestContext, type TestContext } from '../setup/test-app';

let ctx: TestContext;
beforeAll(async () => {
  ctx = await createTestContext();
});
afterAll(async () => {
  await ctx.close();
});

describe('API basics', () => {
  it('reports health with a database ping', async () => {
    const res = await supertest(ctx.app).get('/api/health').expect(200);
    expect(res.body).toMatchObject({ status: 'ok', database: 'up' });
    expect(res.headers['x-request-id']).toMatch(/^[0-9a-f-]{36}$/);
  });

  it('gzips responses for clients that accept it (RFC 9110 §8.4.1)', async () => {
    const who = await signUp(ctx);
    for (let i = 0; i < 30; i++)
      await createAnimal(ctx.database.db, who.collectionId, { name: `Gzip ${i}` });
    const zipped = await who.agent
      .get(`/api/collections/${who.collectionId}/animals`)
      .set('Accept-Encoding', 'gzip')
      .expect(200);
    expect(zipped.headers['content-encoding']).toBe('gzip');
    expect(zipped.body.animals).toHaveLength(30);
    const plain = await who.agent
      .get(`/api/collections/${who.collectionId}/animals`)
      .set('Accept-Encoding', 'identity')
      .expect(200);
    expect(plain.headers['content-encoding']).toBeUndefined();
  });

  it('answers an unknown /api route with JSON 404', async () => {
    const res = await supertest(ctx.app).get('/api/no-such-thing').expect(404);
    expect(res.body.error).toMatchObject({ code: 'not_found' });
  });

  it('answers invalid JSON with 400 and an oversized body with 413', async () => {
    const bad = await ctx
      .agent()
      .post('/api/auth/sign-in')
      .set('Content-Type', 'application/json')
      .send('{"email": ');
    expect(bad.status).toBe(400);
    expect(bad.body.error.message).toMatch(/not valid JSON/);
    const big = await ctx
      .agent()
      .post('/api/auth/sign-in')
      .send({ email: 'a@b.test', password: 'x'.repeat(2_000_000) });
    expect(big.status).toBe(413);
    expect(big.body.error.code).toBe('too_large');
  });

  it('validates at the edge with field messages (422)', async () => {
    const res = await ctx.agent().post('/api/auth/sign-in').send({ email: 'not-an-email' });
    expect(res.status).toBe(422);
    expect(res.body.error.issues.map((i: { path: string }) => i.path).sort()).toEqual([
      'body.email',
      'body.password',
    ]);
  });

  it('refuses a cookie-authenticated write without the app header, or from another origin (CSRF)', async () => {
    const { email } = await signUp(ctx);
    const cookie = sessionCookie(
      await ctx.agent().post('/api/auth/sign-in').send({ email, password: PASSWORD }),
    )!;
    // The session cookie without our header: what a cross-site form post would carry.
    const forged = await supertest(ctx.app).post('/api/auth/sign-out').set('Cookie', cookie);
    expect(forged.status).toBe(403);
    const crossOrigin = await supertest(ctx.app)
      .post('/api/auth/sign-out')
      .set('Cookie', cookie)
      .set('X-Rackside-Client', '1')
      .set('Origin', 'https://evil.example');
    expect(crossOrigin.status).toBe(403);
    expect(crossOrigin.body.error.code).toBe('csrf');
    await supertest(ctx.app).get('/api/auth/me').set('Cookie', cookie).expect(200);
  });

  it('sends a Content-Security-Policy allowing only our own origin', async () => {
    const res = await supertest(ctx.app).get('/api/health');
    const csp = res.headers['content-security-policy'] as string;
    expect(csp).toContain("default-src 'self'");
    expect(csp).toContain("font-src 'self'");
    expect(csp).toContain("media-src 'self' blob:");
    expect(csp).not.toMatch(/https?:\/\//);
    expect(res.headers['permissions-policy']).toContain('camera=(self)');
  });
});
