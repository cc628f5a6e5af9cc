// The demo delivery (issue 5 follow-up): a fresh seeded app opens "Salt Road" with a submitted, checked v1
// whose previews and waveforms play in the review room.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { deliveryPaths } from '@shared/schemas/deliveries';
import { startTestApp, DEMO_PASSWORD, type ApiClient, type TestApp } from './helpers/test-app';
import { bookingStatus } from './helpers/money';

let app: TestApp;
let ines: ApiClient;

async function login(email: string): Promise<ApiClient> {
  const client = app.client();
  const res = await client.post('/api/auth/login', { email, password: DEMO_PASSWORD });
  if (res.status !== 200) throw new Error(`login ${email}: ${res.status}`);
  return client;
}

beforeAll(async () => {
  app = await startTestApp({ seed: true });
  ines = await login('ines@kitlane.test');
}, 120_000);
afterAll(async () => {
  await app?.close();
});

async function saltRoadDelivery(client: ApiClient) {
  const bookingId = app.db.$client.prepare(`select b.id from bookings b join briefs r on r.id = b.brief_id where r.song_title = 'Salt Road'`).get() as { id: string };
  const list = await client.get(deliveryPaths.list(bookingId.id));
  expect(list.status).toBe(200);
  return { bookingId: bookingId.id, items: list.body.items as any[] };
}

describe('the demo delivery', () => {
  it('shows the songwriter a submitted v1 of eight checked stems on the delivered booking', async () => {
    const { bookingId, items } = await saltRoadDelivery(ines);
    expect(bookingStatus(app.db, bookingId)).toBe('delivered');
    expect(items).toHaveLength(1);
    const [v1] = items;
    expect(v1).toMatchObject({ number: 1, status: 'ready', decision: null });
    expect(v1.submittedAt).not.toBeNull();
    expect(v1.files).toHaveLength(8);
    for (const f of v1.files) expect(f).toMatchObject({ status: 'uploaded', previewStatus: 'ready', hasPeaks: true });
    expect(v1.can).toMatchObject({ accept: true, requestChanges: true });
  });

  it('reports the snare bottom as inverted against the top, at the brief’s rate and depth, 20–30 s long', async () => {
    const { items } = await saltRoadDelivery(ines);
    const report = items[0].check.report;
    expect(report.unreadable).toEqual([]);
    const snare = report.pairs.find((p: any) => /Snare Top/.test(p.a + p.b) && /Snare Bottom/.test(p.a + p.b));
    expect(snare?.polarity).toBe('inverted');
    for (const stem of report.stems) {
      expect(stem.sampleRate).toBe(48_000);
      expect(stem.durationSec).toBeGreaterThanOrEqual(20);
      expect(stem.durationSec).toBeLessThanOrEqual(30);
    }
  });

  it('serves a preview and peaks for the review room, and keeps the originals locked until acceptance', async () => {
    const { items } = await saltRoadDelivery(ines);
    const [v1] = items;
    const file = v1.files[0];
    const preview = await fetch(`${app.url}/api/deliveries/${v1.id}/files/${file.id}/preview`, { headers: { cookie: (ines as unknown as { cookie: string }).cookie } });
    expect(preview.status).toBe(200);
    expect(preview.headers.get('content-type')).toBe('audio/mpeg');
    expect((await preview.arrayBuffer()).byteLength).toBeGreaterThan(10_000);
    const peaks = await ines.get(`/api/deliveries/${v1.id}/files/${file.id}/peaks`);
    expect(peaks.status).toBe(200);
    const original = await ines.get(`/api/deliveries/${v1.id}/files/${file.id}/original`);
    expect(original.status).toBe(403);
  });

  it('hides the demo delivery from a drummer who is not on the booking', async () => {
    const other = await login('odell@kitlane.test').catch(() => null);
    if (!other) throw new Error('the demo drummer odell is missing');
    const { bookingId } = await saltRoadDelivery(ines);
    const res = await other.get(deliveryPaths.list(bookingId));
    expect(res.status).toBe(404);
  });
});
