import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startTestApp, tokenFromMail, type TestApp } from './helpers/test-app';

let app: TestApp;
beforeAll(async () => {
  app = await startTestApp({ limits: { loginPerAccount: { windowMs: 60_000, limit: 5 } } });
});
afterAll(async () => {
  await app?.close();
});

const good = { password: 'a-long-fine-pass-1', displayName: 'Nell Ostrander' };

describe('sign-up and verification', () => {
  it('signs up, mails a verification link, and the link verifies and signs in', async () => {
    const c = app.client();
    const res = await c.post('/api/auth/signup', { ...good, email: 'Nell@Example.test', roles: ['drummer', 'engineer'] });
    expect(res.status).toBe(201);
    expect(res.body.user).toMatchObject({ email: 'nell@example.test', roles: ['drummer', 'engineer'], emailVerified: false });
    expect(res.headers.get('set-cookie')).toMatch(/HttpOnly/);
    expect(res.headers.get('set-cookie')).toMatch(/SameSite=Lax/);
    expect(res.headers.get('set-cookie')).not.toMatch(/Secure/);

    const mail = await app.waitForMail('nell@example.test', /Confirm your email/);
    const token = tokenFromMail(mail, '/verify-email');

    const browser = app.client();
    const verified = await browser.post('/api/auth/verify-email', { token });
    expect(verified.status).toBe(200);
    const me = await browser.get('/api/me');
    expect(me.body.user).toMatchObject({ email: 'nell@example.test', roles: ['drummer', 'engineer'], emailVerified: true });

    const again = await app.client().post('/api/auth/verify-email', { token });
    expect(again.status).toBe(400);
    expect(again.body.error.code).toBe('invalid_token');
  });

  it('refuses a duplicate email with 409', async () => {
    await app.client().post('/api/auth/signup', { ...good, email: 'dup@example.test', roles: ['songwriter'] });
    const res = await app.client().post('/api/auth/signup', { ...good, email: 'DUP@example.test', roles: ['drummer'] });
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe('email_taken');
    expect(res.body.error.fields.email).toBeTruthy();
  });

  it('answers 400 with field errors for a bad email, a short password and a common password', async () => {
    const bad = await app.client().post('/api/auth/signup', { email: 'not-an-email', password: 'short', displayName: 'X', roles: [] });
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.body.error.fields).sort()).toEqual(['displayName', 'email', 'password', 'roles']);
    const common = await app.client().post('/api/auth/signup', { ...good, email: 'c@example.test', password: 'password123', roles: ['drummer'] });
    expect(common.status).toBe(400);
    expect(common.body.error.fields.password).toMatch(/common/);
  });

  it('never lets admin be chosen at sign-up', async () => {
    const res = await app.client().post('/api/auth/signup', { ...good, email: 'sneaky@example.test', roles: ['admin'] });
    expect(res.status).toBe(400);
    expect(res.body.error.fields['roles.0']).toBeTruthy();
    const login = await app.client().post('/api/auth/login', { email: 'sneaky@example.test', password: good.password });
    expect(login.status).toBe(401);
  });
});

describe('sign-in', () => {
  it('gives a wrong password and an unknown email the same 401 answer', async () => {
    await app.client().post('/api/auth/signup', { ...good, email: 'same@example.test', roles: ['songwriter'] });
    const wrong = await app.client().post('/api/auth/login', { email: 'same@example.test', password: 'not-the-password' });
    const unknown = await app.client().post('/api/auth/login', { email: 'nobody@example.test', password: 'not-the-password' });
    expect(wrong.status).toBe(401);
    expect(unknown.status).toBe(401);
    expect(wrong.body).toEqual(unknown.body);
  });

  it('signs in and out', async () => {
    const c = app.client();
    const login = await c.post('/api/auth/login', { email: 'same@example.test', password: good.password });
    expect(login.status).toBe(200);
    expect((await c.get('/api/me')).body.user.email).toBe('same@example.test');
    expect((await c.post('/api/auth/logout')).status).toBe(204);
    expect((await c.get('/api/me')).body.user).toBeNull();
  });
});

describe('password reset and change', () => {
  it('resets a password end to end through the mail catcher', async () => {
    await app.client().post('/api/auth/signup', { ...good, email: 'forgot@example.test', roles: ['songwriter'] });
    const asked = await app.client().post('/api/auth/forgot-password', { email: 'forgot@example.test' });
    expect(asked.status).toBe(202);
    const unknown = await app.client().post('/api/auth/forgot-password', { email: 'ghost@example.test' });
    expect(unknown.status).toBe(202);
    const mail = await app.waitForMail('forgot@example.test', /Reset your Kitlane password/);
    const token = tokenFromMail(mail, '/reset-password');
    const reset = await app.client().post('/api/auth/reset-password', { token, password: 'a-brand-new-pass-2' });
    expect(reset.status).toBe(204);
    expect((await app.client().post('/api/auth/login', { email: 'forgot@example.test', password: good.password })).status).toBe(401);
    expect((await app.client().post('/api/auth/login', { email: 'forgot@example.test', password: 'a-brand-new-pass-2' })).status).toBe(200);
    expect((await app.client().post('/api/auth/reset-password', { token, password: 'another-new-pass-3' })).status).toBe(400);
  });

  it('changes the password only with the current one, and edits the account', async () => {
    const c = app.client();
    await c.post('/api/auth/signup', { ...good, email: 'change@example.test', roles: ['songwriter'] });
    const wrong = await c.post('/api/account/password', { currentPassword: 'nope-nope-nope', newPassword: 'b-brand-new-pass-2' });
    expect(wrong.status).toBe(400);
    expect(wrong.body.error.fields.currentPassword).toBeTruthy();
    expect((await c.post('/api/account/password', { currentPassword: good.password, newPassword: 'b-brand-new-pass-2' })).status).toBe(204);
    const edited = await c.patch('/api/account', { displayName: 'Changed Name', roles: ['songwriter', 'drummer'], timeZone: 'Europe/Paris' });
    expect(edited.status).toBe(200);
    expect(edited.body.user).toMatchObject({ displayName: 'Changed Name', roles: ['songwriter', 'drummer'], timeZone: 'Europe/Paris' });
    const badZone = await c.patch('/api/account', { displayName: 'Changed Name', roles: ['admin'], timeZone: 'Mars/Olympus' });
    expect(badZone.status).toBe(400);
    expect(Object.keys(badZone.body.error.fields).sort()).toEqual(['roles.0', 'timeZone']);
  });
});

describe('guards', () => {
  it('refuses a cross-origin POST with 403', async () => {
    const res = await app.client().post('/api/auth/login', { email: 'a@b.test', password: 'x' }, { origin: 'https://evil.example' });
    expect(res.status).toBe(403);
    expect(res.body.error.code).toBe('cross_origin');
    const same = await app.client().post('/api/auth/login', { email: 'a@b.test', password: 'xxxxxxxxxx' }, { origin: 'http://kitlane.test' });
    expect(same.status).toBe(401);
  });

  it('answers a sign-in flood with 429 and Retry-After', async () => {
    const c = app.client();
    let last;
    for (let i = 0; i < 8; i++) last = await c.post('/api/auth/login', { email: 'flood@example.test', password: 'whatever-123' });
    expect(last!.status).toBe(429);
    expect(Number(last!.headers.get('retry-after'))).toBeGreaterThan(0);
    expect(last!.body.error.code).toBe('rate_limited');
  });

  it('never answers bad input with a 500', async () => {
    const c = app.client();
    const malformed = await c.request('POST', '/api/auth/login', '{"email":', { 'content-type': 'application/json' });
    expect(malformed.status).toBe(400);
    expect(malformed.body.error.code).toBe('malformed_json');
    const types = await c.post('/api/auth/signup', { email: 42, password: ['x'], displayName: null, roles: 'drummer' });
    expect(types.status).toBe(400);
    const huge = await c.post('/api/auth/signup', { email: 'x@y.test', password: 'a'.repeat(200_000), displayName: 'x', roles: ['drummer'] });
    expect(huge.status).toBe(413);
    const unknown = await c.get('/api/no-such-thing');
    expect(unknown.status).toBe(404);
    expect(unknown.body.error.code).toBe('not_found');
    const extra = await c.post('/api/auth/signup', { ...good, email: 'extra@example.test', roles: ['drummer'], isAdmin: true });
    expect(extra.status).toBe(400);
  });

  it('sends helmet headers on every response and a health check', async () => {
    const res = await app.client().get('/api/health');
    expect(res.status).toBe(200);
    expect(res.body).toEqual({ ok: true });
    expect(res.headers.get('x-content-type-options')).toBe('nosniff');
    expect(res.headers.get('content-security-policy')).toContain("script-src 'self'");
    expect(res.headers.get('content-security-policy')).not.toMatch(/script-src[^;]*unsafe-inline/);
  });
});

describe('content security policy with a real payment key', () => {
  it('allows Stripe.js only when a real publishable key is configured', async () => {
    const withKey = await startTestApp({ env: { STRIPE_PUBLISHABLE_KEY: 'pk_test_example' } });
    try {
      const csp = (await withKey.client().get('/api/health')).headers.get('content-security-policy')!;
      expect(csp).toMatch(/script-src 'self' https:\/\/js\.stripe\.com/);
      expect(csp).toMatch(/frame-src 'self' https:\/\/js\.stripe\.com/);
    } finally {
      await withKey.close();
    }
    const csp = (await app.client().get('/api/health')).headers.get('content-security-policy')!;
    expect(csp).not.toContain('stripe.com');
  });
});
