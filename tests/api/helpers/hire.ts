// Helpers for the briefs/quotes/bookings API tests: a valid brief and quote body, multipart uploads
// through a client's session, and a published brief in one call.
import { todayIn } from '@shared/schemas/briefs';
import { guideWav } from '../../../server/features/briefs/guide-synth';
import type { ApiClient, ApiResponse } from './test-app';

export function daysFromToday(days: number, timeZone = 'UTC'): string {
  const [y, m, d] = todayIn(timeZone).split('-').map(Number);
  return new Date(Date.UTC(y, m - 1, d + days)).toISOString().slice(0, 10);
}

export function briefBody(overrides: Record<string, unknown> = {}) {
  return {
    songTitle: 'Harbour Lights',
    description: 'A mid-tempo rock song about leaving a small town.',
    drumNotes: 'Driving eighths on the hats, big fills into the choruses.',
    style: 'rock',
    tempoBpm: 120,
    timeSignature: '4/4',
    musicalKey: 'E minor',
    lengthBars: 96,
    lengthSeconds: null,
    songCount: 2,
    referenceNotes: 'Dry, tight kit; no room reverb.',
    sampleRate: 48000,
    bitDepth: '24',
    stemMode: 'every_mic',
    stemList: [],
    roughMix: true,
    budgetMinMinor: 20000,
    budgetMaxMinor: 60000,
    currency: 'USD',
    deadline: daysFromToday(30),
    needsRoom: false,
    ...overrides,
  };
}

export function quoteBody(overrides: Record<string, unknown> = {}) {
  return {
    perSongFeeMinor: 15000,
    rushFeeMinor: 2500,
    extraRevisionMinor: 4000,
    revisionsIncluded: 2,
    turnaroundDays: 7,
    recordingDate: daysFromToday(5),
    rightsTerms: 'buyout',
    royaltyPoints: null,
    message: 'Happy to play this one.',
    validDays: 14,
    ...overrides,
  };
}

/** The session cookie of a test client; ApiClient keeps it private because tests normally never need it. */
function cookieOf(client: ApiClient): string {
  return (client as unknown as { cookie: string }).cookie;
}

export async function uploadFile(
  client: ApiClient,
  base: string,
  path: string,
  file: { bytes: Buffer; name: string; type: string; field?: string },
): Promise<ApiResponse> {
  const form = new FormData();
  form.append(file.field ?? 'file', new Blob([new Uint8Array(file.bytes)], { type: file.type }), file.name);
  const res = await fetch(base + path, { method: 'POST', body: form, headers: { cookie: cookieOf(client) } });
  const text = await res.text();
  let body: unknown = text;
  try {
    body = text ? JSON.parse(text) : null;
  } catch {
    /* keep text */
  }
  return { status: res.status, body, headers: res.headers };
}

export function fetchWithSession(client: ApiClient, url: string, headers: Record<string, string> = {}) {
  return fetch(url, { headers: { ...headers, cookie: cookieOf(client) } });
}

export const demoGuide = (seconds = 4) => guideWav({ seconds, tempoBpm: 120, rootHz: 82.41, sampleRate: 22050 });

/** Creates and publishes a brief; returns its id. */
export async function publishedBrief(client: ApiClient, overrides: Record<string, unknown> = {}): Promise<string> {
  const created = await client.post('/api/briefs', briefBody(overrides));
  if (created.status !== 201) throw new Error(`brief create failed: ${created.status} ${JSON.stringify(created.body)}`);
  const published = await client.post(`/api/briefs/${created.body.brief.id}/publish`);
  if (published.status !== 200) throw new Error(`publish failed: ${published.status} ${JSON.stringify(published.body)}`);
  return created.body.brief.id as string;
}
