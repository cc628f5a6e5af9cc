// The admin desk (issue 4): the dispute queue and case file, accounts (disable, enable, grant), bookings
// search and the audit log. Every route is tried with a non-admin (403) and signed out (401).
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startTestApp, type TestApp } from './helpers/test-app';
import { fundBooking, insertBooking, onboard, person, type Person } from './helpers/money';

let app: TestApp;
let songwriter: Person;
let drummer: Person;
let outsider: Person;
let admin: Person;
let disputeIds: string[];
let firstBookingId: string;

const reasonText = 'The fills in the bridge are not what we agreed in the brief.';

beforeAll(async () => {
  app = await startTestApp();
  [songwriter, drummer, outsider] = await Promise.all([
    person(app, 'sw@example.test', ['songwriter'], 'Nell Songwriter'),
    person(app, 'dr@example.test', ['drummer'], 'Odo Drummer'),
    person(app, 'out@example.test', ['songwriter', 'drummer', 'engineer'], 'Uma Outsider'),
  ]);
  admin = await person(app, 'admin@example.test', ['songwriter'], 'Ari Admin');
  app.db.$client.prepare(`update users set roles = '["admin"]' where id = ?`).run(admin.id);
  await onboard(app, drummer);
  disputeIds = [];
  for (const title of ['Queue One', 'Queue Two']) {
    const id = insertBooking(app.db, { songwriterId: songwriter.id, drummerId: drummer.id, songTitle: title });
    firstBookingId ??= id;
    await fundBooking(app, songwriter, id);
    const res = await songwriter.client.post(`/api/bookings/${id}/disputes`, { reason: 'not_as_briefed', text: reasonText });
    disputeIds.push(res.body.dispute.id);
  }
  const thread = await drummer.client.post(`/api/bookings/${firstBookingId}/thread`);
  const sent = await drummer.client.post(`/api/threads/${thread.body.thread.id}/messages`, { body: 'I played what the guide track asked for.' });
  if (sent.status !== 201) throw new Error(`message not sent: ${sent.status} ${JSON.stringify(sent.body)}`);
});
afterAll(async () => {
  await app?.close();
});

describe('who reaches the desk', () => {
  const routes: [string, string, unknown?][] = [
    ['GET', '/api/admin/disputes'],
    ['GET', '/api/admin/disputes/DISPUTE'],
    ['POST', '/api/admin/disputes/DISPUTE/preview', { outcome: 'release' }],
    ['POST', '/api/admin/disputes/DISPUTE/settle', { outcome: 'release', note: 'Released by a stranger' }],
    ['GET', '/api/admin/accounts'],
    ['POST', '/api/admin/accounts/USER/disable', { reason: 'Because I can' }],
    ['POST', '/api/admin/accounts/USER/enable', { reason: 'Because I can' }],
    ['POST', '/api/admin/accounts/USER/grant-admin', { reason: 'Because I can' }],
    ['GET', '/api/admin/bookings'],
    ['GET', '/api/admin/audit'],
  ];

  it.each(routes)('%s %s answers 403 to a non-admin and 401 signed out', async (method, template, body) => {
    const path = template.replace('DISPUTE', disputeIds[0]).replace('USER', drummer.id);
    for (const who of [songwriter, outsider]) {
      const res = await who.client.request(method, path, body);
      expect(res.status).toBe(403);
      expect(res.body.error.code).toBe('forbidden');
    }
    expect((await app.client().request(method, path, body)).status).toBe(401);
  });
});

describe('the dispute queue and case file', () => {
  it('lists open disputes oldest first', async () => {
    const res = await admin.client.get('/api/admin/disputes?status=open');
    expect(res.status).toBe(200);
    expect(res.body.items.map((d: { id: string }) => d.id)).toEqual(disputeIds);
    expect(res.body.items[0]).toMatchObject({ songTitle: 'Queue One', reason: 'not_as_briefed', openedBy: { displayName: 'Nell Songwriter', role: 'songwriter' } });
    expect((await admin.client.get('/api/admin/disputes?status=maybe')).status).toBe(400);
  });

  it('shows the agreed terms, the thread, the deliveries (or that there are none) and the ledger', async () => {
    const res = await admin.client.get(`/api/admin/disputes/${disputeIds[0]}`);
    expect(res.status).toBe(200);
    const file = res.body.case;
    expect(file.dispute.text).toBe(reasonText);
    expect(file.booking.terms).toMatchObject({ songTitle: 'Queue One', totalMinor: 30_000, rightsTerms: 'buyout' });
    expect(file.messages.map((m: { body: string; senderName: string }) => [m.senderName, m.body])).toContainEqual(['Odo Drummer', 'I played what the guide track asked for.']);
    expect(file.deliveries.items).toEqual([]);
    expect(file.ledger.escrowHeldMinor).toBe(30_000);
    expect(file.ledger.transactions.length).toBeGreaterThan(0);
    expect((await admin.client.get('/api/admin/disputes/no-such-dispute')).status).toBe(404);
  });
});

describe('accounts', () => {
  it('finds accounts by name or email, with their bookings counted', async () => {
    const res = await admin.client.get('/api/admin/accounts?q=odo');
    expect(res.status).toBe(200);
    expect(res.body.items).toEqual([expect.objectContaining({ id: drummer.id, email: 'dr@example.test', bookings: 2, disabledAt: null })]);
    expect(res.body.total).toBe(1);
    expect((await admin.client.get('/api/admin/accounts?q=%25')).body.items).toEqual([]);
    expect((await admin.client.get('/api/admin/accounts?limit=0')).status).toBe(400);
  });

  it('disables an account: its sessions end and it cannot sign in; enabling lets it back in', async () => {
    const target = await person(app, 'gone@example.test', ['drummer'], 'Gale Gone');
    expect((await target.client.get('/api/me')).body.user.id).toBe(target.id);
    const disabled = await admin.client.post(`/api/admin/accounts/${target.id}/disable`, { reason: 'Repeated abuse in messages' });
    expect(disabled.status).toBe(200);
    expect(disabled.body.account.disabledAt).not.toBeNull();
    expect((await target.client.get('/api/me')).body.user).toBeNull();
    const login = await app.client().post('/api/auth/login', { email: 'gone@example.test', password: 'a-long-fine-pass-1' });
    expect(login.status).toBe(403);
    expect(login.body.error.code).toBe('account_disabled');
    expect((await admin.client.post(`/api/admin/accounts/${target.id}/disable`, { reason: 'Once more with feeling' })).status).toBe(409);

    expect((await admin.client.post(`/api/admin/accounts/${target.id}/enable`, { reason: 'Apologised and promised' })).status).toBe(200);
    expect((await app.client().post('/api/auth/login', { email: 'gone@example.test', password: 'a-long-fine-pass-1' })).status).toBe(200);
  });

  it('refuses changing one’s own account, a missing reason and an unknown account', async () => {
    expect((await admin.client.post(`/api/admin/accounts/${admin.id}/disable`, { reason: 'Locking myself out' })).status).toBe(400);
    const noReason = await admin.client.post(`/api/admin/accounts/${drummer.id}/disable`, {});
    expect(noReason.status).toBe(400);
    expect(noReason.body.error.fields).toHaveProperty('reason');
    expect((await admin.client.post('/api/admin/accounts/nobody/disable', { reason: 'No such person' })).status).toBe(404);
  });

  it('grants admin, and the new admin reaches the desk', async () => {
    const helper = await person(app, 'helper@example.test', ['songwriter'], 'Hal Helper');
    expect((await helper.client.get('/api/admin/disputes')).status).toBe(403);
    const res = await admin.client.post(`/api/admin/accounts/${helper.id}/grant-admin`, { reason: 'Joins the support rota' });
    expect(res.status).toBe(200);
    expect(res.body.account.roles).toEqual(['songwriter', 'admin']);
    expect((await helper.client.get('/api/admin/disputes')).status).toBe(200);
    expect((await admin.client.post(`/api/admin/accounts/${helper.id}/grant-admin`, { reason: 'Joins the support rota' })).status).toBe(409);
  });
});

describe('bookings search and the audit log', () => {
  it('finds bookings by song title, party and status, with their open dispute', async () => {
    const byTitle = await admin.client.get('/api/admin/bookings?q=queue%20two');
    expect(byTitle.body.items.map((b: { songTitle: string }) => b.songTitle)).toEqual(['Queue Two']);
    expect(byTitle.body.items[0]).toMatchObject({ status: 'disputed', songwriter: 'Nell Songwriter', drummer: 'Odo Drummer', openDisputeId: disputeIds[1] });
    const byParty = await admin.client.get('/api/admin/bookings?q=dr@example.test&status=disputed');
    expect(byParty.body.total).toBe(2);
    expect((await admin.client.get('/api/admin/bookings?status=funded')).body.total).toBe(0);
    expect((await admin.client.get('/api/admin/bookings?status=lost')).status).toBe(400);
  });

  it('lists every admin action newest first with who, what, target and amounts', async () => {
    const target = await person(app, 'audited@example.test', ['drummer'], 'Aud Ited');
    await admin.client.post(`/api/admin/accounts/${target.id}/disable`, { reason: 'Spam quotes' });
    await admin.client.post(`/api/admin/accounts/${target.id}/enable`, { reason: 'Cleared up' });
    await admin.client.post(`/api/admin/disputes/${disputeIds[1]}/settle`, { outcome: 'refund', note: 'The booking never started.' });
    const res = await admin.client.get('/api/admin/audit?limit=4');
    expect(res.status).toBe(200);
    const actions = res.body.items.map((e: { action: string }) => e.action);
    expect(actions.slice(0, 2).sort()).toEqual(['refund', 'settle']);
    expect(actions.slice(2)).toEqual(['enable', 'disable']);
    const settle = res.body.items.find((e: { action: string }) => e.action === 'settle');
    expect(settle).toMatchObject({ actor: { id: admin.id, displayName: 'Ari Admin (admin@example.test)' }, targetType: 'dispute', targetLabel: 'Dispute on “Queue Two”', amounts: { currency: 'USD', heldMinor: 30_000, songwriterMinor: 31_500, payeesMinor: 0 } });
    expect(res.body.items[3]).toMatchObject({ action: 'disable', targetLabel: 'Aud Ited (audited@example.test)', note: 'Spam quotes' });
    expect(res.body.total).toBeGreaterThanOrEqual(res.body.items.length);
  });
});

describe('admin money actions outside a dispute', () => {
  it('audits a direct admin release and refund', async () => {
    const released = insertBooking(app.db, { songwriterId: songwriter.id, drummerId: drummer.id, songTitle: 'Direct Release' });
    await fundBooking(app, songwriter, released);
    const rel = await admin.client.post(`/api/bookings/${released}/release`, { reason: 'Admin decision after a call' });
    expect(rel.status).toBe(200);
    const refunded = insertBooking(app.db, { songwriterId: songwriter.id, drummerId: drummer.id, songTitle: 'Direct Refund' });
    await fundBooking(app, songwriter, refunded);
    const ref = await admin.client.post(`/api/bookings/${refunded}/refund`, { reason: 'Drummer fell ill' });
    expect(ref.status).toBe(200);
    const audit = await admin.client.get('/api/admin/audit?limit=20');
    const rows = audit.body.items as { action: string; targetId: string; note: string }[];
    expect(rows.find((r) => r.targetId === released)).toMatchObject({ action: 'release', note: 'Admin decision after a call' });
    expect(rows.find((r) => r.targetId === refunded)).toMatchObject({ action: 'refund', note: 'Drummer fell ill' });
  });
});
