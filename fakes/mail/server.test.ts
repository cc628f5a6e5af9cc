import net from 'node:net';
import nodemailer from 'nodemailer';
import { afterEach, describe, expect, it } from 'vitest';
import { startMailCatcher, type CaughtMail, type MailCatcher } from './server';

let catcher: MailCatcher | undefined;

afterEach(async () => {
  await catcher?.close();
  catcher = undefined;
});

async function start(opts: Parameters<typeof startMailCatcher>[0] = {}): Promise<MailCatcher> {
  catcher = await startMailCatcher({ smtpPort: 0, webPort: 0, ...opts });
  return catcher;
}

function transportFor(c: MailCatcher, extra: Record<string, unknown> = {}) {
  return nodemailer.createTransport({ host: '127.0.0.1', port: c.smtpPort, secure: false, ignoreTLS: true, ...extra });
}

async function getJson<T>(c: MailCatcher, path: string): Promise<{ status: number; body: T }> {
  const res = await fetch(c.webUrl + path);
  return { status: res.status, body: (await res.json()) as T };
}

function canConnect(port: number): Promise<boolean> {
  return new Promise((resolve) => {
    const socket = net.connect(port, '127.0.0.1');
    socket.once('connect', () => {
      socket.destroy();
      resolve(true);
    });
    socket.once('error', () => resolve(false));
  });
}

describe('mail catcher', () => {
  it('listens on loopback and random ports when asked for port 0', async () => {
    const c = await start();
    expect(c.smtpPort).toBeGreaterThan(0);
    expect(c.webPort).toBeGreaterThan(0);
    expect(c.smtpPort).not.toBe(c.webPort);
    expect(c.webUrl).toBe(`http://127.0.0.1:${c.webPort}`);
  });

  it('shows mail sent over SMTP in /api/messages with its links extracted', async () => {
    const c = await start();
    await transportFor(c).sendMail({
      from: '"Kitlane" <no-reply@kitlane.test>',
      to: 'songwriter@example.test',
      subject: 'Confirm your address',
      text: 'Open http://localhost:3000/verify?token=abc&next=%2Fbriefs to confirm.',
      html: '<p><a href="http://localhost:3000/verify?token=abc&amp;next=%2Fbriefs">Confirm</a> or <a href="#top">top</a></p>',
    });

    const { status, body } = await getJson<CaughtMail[]>(c, '/api/messages');
    expect(status).toBe(200);
    expect(body).toHaveLength(1);
    const [mail] = body;
    expect(mail.from).toBe('no-reply@kitlane.test');
    expect(mail.to).toEqual(['songwriter@example.test']);
    expect(mail.subject).toBe('Confirm your address');
    expect(mail.text).toContain('to confirm.');
    expect(mail.html).toContain('<a href=');
    // The HTML href and the text URL are the same link once &amp; is decoded: listed once, fragment dropped.
    expect(mail.links).toEqual(['http://localhost:3000/verify?token=abc&next=%2Fbriefs']);
    expect(Date.parse(mail.date)).not.toBeNaN();

    const one = await getJson<CaughtMail>(c, `/api/messages/${mail.id}`);
    expect(one.body).toEqual(mail);
    expect(c.messages()).toEqual(body);
  });

  it('lists newest first and filters by recipient with ?to=, Bcc included, case-insensitively', async () => {
    const c = await start();
    const transport = transportFor(c);
    await transport.sendMail({ from: 'a@kitlane.test', to: 'drummer@example.test', subject: 'first', text: 'one' });
    await transport.sendMail({ from: 'a@kitlane.test', to: 'engineer@example.test', subject: 'second', text: 'two' });
    await transport.sendMail({ from: 'a@kitlane.test', to: 'other@example.test', bcc: 'drummer@example.test', subject: 'third', text: 'three' });

    const all = await getJson<CaughtMail[]>(c, '/api/messages');
    expect(all.body.map((m) => m.subject)).toEqual(['third', 'second', 'first']);

    const drummer = await getJson<CaughtMail[]>(c, `/api/messages?to=${encodeURIComponent('Drummer@Example.test')}`);
    expect(drummer.body.map((m) => m.subject)).toEqual(['third', 'first']);

    const nobody = await getJson<CaughtMail[]>(c, '/api/messages?to=nobody%40example.test');
    expect(nobody.body).toEqual([]);
  });

  it('escapes a subject carrying a script tag in the inbox and the message page', async () => {
    const c = await start();
    const subject = '<script>alert("x")</script> & "quotes"';
    await transportFor(c).sendMail({ from: 'a@kitlane.test', to: 'x@example.test', subject, text: 'body <b>not bold</b>' });
    const [mail] = c.messages();

    const inbox = await (await fetch(c.webUrl + '/')).text();
    expect(inbox).toContain('&lt;script&gt;alert(&quot;x&quot;)&lt;/script&gt; &amp; &quot;quotes&quot;');
    expect(inbox).not.toContain('<script>');
    expect(inbox).toContain('Kitlane local mail catcher — nothing leaves this machine');

    const page = await fetch(`${c.webUrl}/messages/${mail.id}`);
    expect(page.headers.get('content-security-policy')).toContain("default-src 'none'");
    const html = await page.text();
    expect(html).not.toContain('<script>');
    expect(html).toContain('&lt;script&gt;');
    expect(html).toContain('body &lt;b&gt;not bold&lt;/b&gt;');
  });

  it('serves the message HTML sandboxed and makes links clickable on the message page', async () => {
    const c = await start();
    await transportFor(c).sendMail({
      from: 'a@kitlane.test',
      to: 'x@example.test',
      subject: 'Links',
      text: 'See https://kitlane.test/bookings/7.',
      html: '<html><head><title>t</title></head><body><a href="https://kitlane.test/bookings/7">booking</a></body></html>',
    });
    const [mail] = c.messages();

    const page = await (await fetch(`${c.webUrl}/messages/${mail.id}`)).text();
    expect(page).toContain(`<iframe src="/messages/${mail.id}/html"`);
    expect(page).toMatch(/sandbox="allow-popups allow-popups-to-escape-sandbox"/);
    // The text part's URL is a link without its trailing full stop.
    expect(page).toContain('<a href="https://kitlane.test/bookings/7" rel="noreferrer">https://kitlane.test/bookings/7</a>.');

    const own = await fetch(`${c.webUrl}/messages/${mail.id}/html`);
    expect(own.status).toBe(200);
    expect(own.headers.get('content-security-policy')).toMatch(/^sandbox allow-popups/);
    expect(await own.text()).toContain('<head><base target="_blank"><title>');
  });

  it('answers unknown messages with 404 and a JSON error', async () => {
    const c = await start();
    const missing = await getJson<{ error: { code: string } }>(c, '/api/messages/999');
    expect(missing.status).toBe(404);
    expect(missing.body.error.code).toBe('not_found');
    expect((await fetch(`${c.webUrl}/messages/999`)).status).toBe(404);
  });

  it('empties the inbox on DELETE /api/messages and on clear()', async () => {
    const c = await start();
    const transport = transportFor(c);
    await transport.sendMail({ from: 'a@kitlane.test', to: 'x@example.test', subject: 'one', text: '1' });
    await transport.sendMail({ from: 'a@kitlane.test', to: 'x@example.test', subject: 'two', text: '2' });

    const res = await fetch(c.webUrl + '/api/messages', { method: 'DELETE' });
    expect(await res.json()).toEqual({ deleted: 2 });
    expect((await getJson<CaughtMail[]>(c, '/api/messages')).body).toEqual([]);

    await transport.sendMail({ from: 'a@kitlane.test', to: 'x@example.test', subject: 'three', text: '3' });
    expect(c.messages()).toHaveLength(1);
    c.clear();
    expect(c.messages()).toEqual([]);
  });

  it('refuses a cross-site POST to the delete-all form', async () => {
    const c = await start();
    await transportFor(c).sendMail({ from: 'a@kitlane.test', to: 'x@example.test', subject: 'keep', text: 'k' });
    const res = await fetch(c.webUrl + '/clear', { method: 'POST', headers: { Origin: 'http://evil.example' }, redirect: 'manual' });
    expect(res.status).toBe(403);
    expect(c.messages()).toHaveLength(1);
  });

  it('keeps only the newest maxMessages', async () => {
    const c = await start({ maxMessages: 2 });
    const transport = transportFor(c);
    for (const subject of ['a', 'b', 'c']) {
      await transport.sendMail({ from: 'a@kitlane.test', to: 'x@example.test', subject, text: subject });
    }
    expect(c.messages().map((m) => m.subject)).toEqual(['c', 'b']);
  });

  it('refuses an over-size message with SMTP 552 and keeps nothing', async () => {
    const c = await start({ maxMessageBytes: 64 * 1024 });
    const send = transportFor(c).sendMail({ from: 'a@kitlane.test', to: 'x@example.test', subject: 'big', text: 'x'.repeat(200 * 1024) });
    await expect(send).rejects.toMatchObject({ responseCode: 552 });
    expect(c.messages()).toEqual([]);
  });

  it('refuses a message over the default 10 MB limit', async () => {
    const c = await start();
    const attachment = Buffer.alloc(11 * 1024 * 1024, 7);
    const send = transportFor(c).sendMail({ from: 'a@kitlane.test', to: 'x@example.test', subject: 'big', text: 'x', attachments: [{ filename: 'a.bin', content: attachment }] });
    await expect(send).rejects.toMatchObject({ responseCode: 552 });
    expect(c.messages()).toEqual([]);
  });

  it('closes cleanly: both ports stop accepting, even with a pooled client still connected', async () => {
    const c = await start();
    const pooled = transportFor(c, { pool: true, maxConnections: 1 });
    await pooled.sendMail({ from: 'a@kitlane.test', to: 'x@example.test', subject: 'pooled', text: 'p' });
    await fetch(c.webUrl + '/'); // leaves a keep-alive connection behind

    const started = Date.now();
    await c.close();
    expect(Date.now() - started).toBeLessThan(900);
    expect(await canConnect(c.smtpPort)).toBe(false);
    expect(await canConnect(c.webPort)).toBe(false);
    await c.close(); // a second close is harmless
    pooled.close();
    catcher = undefined;
  });
});
