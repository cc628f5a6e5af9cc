// npm run seed:large [-- --count 10000 --dir D]: fills DATA_DIR (default bench/.cache/search-large) with invented drummers for the
// search benchmark. Names come from syllables, texts from our own word lists, all from a seeded PRNG so two
// runs make the same world. Profiles go through the profiles service, so the search triggers index them.
import { randomUUID } from 'node:crypto';
import { join, resolve } from 'node:path';
import { pathToFileURL } from 'node:url';
import { like, sql } from 'drizzle-orm';
import { openDb, type Db } from '../server/db/client';
import { applyMigrations } from '../server/db/migrate';
import { users } from '../server/db/schema';
import { hashPassword } from '../server/auth/password';
import { createProfilesRepository } from '../server/features/profiles/profiles.repository';
import { createProfilesService } from '../server/features/profiles/profiles.service';
import { createReelsRepository } from '../server/features/reels/reels.repository';
import { DRUM_STYLES, RATE_CURRENCIES, type DrummerProfileInput } from '../shared/schemas/profiles';

export const LARGE_EMAIL_DOMAIN = 'large.kitlane.test';
/** Git-ignored; the search bench reuses what is already there. */
export const LARGE_DEFAULT_DIR = 'bench/.cache/search-large';

const SYLLABLES = ['ka', 'lo', 'mer', 'vi', 'dan', 'sor', 'el', 'tu', 'ri', 'ban', 'qua', 'zel', 'mo', 'fen', 'ar', 'is', 'ot', 'len', 'dra', 'pe', 'nu', 'cor', 'sa', 'bel', 'hin', 'gro', 'lia', 'tes', 'vor', 'ym'];
const ADJECTIVES = ['tight', 'loose', 'warm', 'punchy', 'dry', 'roomy', 'heavy', 'light', 'driving', 'laid-back', 'crisp', 'dark', 'bright', 'dynamic', 'steady', 'gritty', 'airy', 'swinging'];
const PHRASES = ['for singer-led songs', 'with a big room sound', 'who plays to the lyric', 'with quick turnaround', 'for live-feel records', 'recording at home', 'with ghost notes and pocket', 'with double kick', 'on brushes and mallets', 'for demos and albums', 'with hand percussion', 'edited to the grid'];
const SENTENCES = [
  'I track in a treated room with close mics and a stereo pair.',
  'Two full takes and a safety, comped to your notes.',
  'I listen to the guide track a few times before I play a note.',
  'Fills stay out of the vocal unless you ask for them.',
  'Every mic comes as its own stem, consolidated from bar one.',
  'I can send a rough mix so you hear the kit in context.',
  'Happy to follow a chart or a programmed demo.',
  'Tempo changes and odd bars are fine.',
  'I tune the kit for each song.',
  'Quiet songs get soft sticks or brushes.',
  'Loud songs get a room pair placed far back.',
  'Ask for a test verse before you book.',
  'I keep the feel human unless you want it on the grid.',
  'Percussion overdubs are possible as extra stems.',
  'I have played in function bands, theatre pits and studio sessions.',
  'Sessions start early in my morning.',
];
const TAGS = ['ghost notes', 'brushes', 'double kick', 'click or no click', 'shuffle', 'reads charts', 'room mics', 'hybrid kit', 'percussion', 'odd meters', 'train beat', 'half-time', 'blast beats', 'one drop', 'soft sticks'];
const KIT_PARTS = ['18" kick', '20" kick', '22" kick', '24" kick', '10" rack tom', '12" rack tom', '13" rack tom', '14" floor tom', '16" floor tom', '14" steel snare', '14" wooden snare', '13" piccolo snare', '14" brass snare', '14" hi-hats', '15" hi-hats', 'a thin crash', 'two crashes', '20" ride', '22" ride', 'a china', 'a splash', 'a cowbell', 'a tambourine'];
const ZONES = ['America/Los_Angeles', 'America/Denver', 'America/Chicago', 'America/New_York', 'America/Sao_Paulo', 'America/Mexico_City', 'America/Bogota', 'Europe/London', 'Europe/Berlin', 'Europe/Stockholm', 'Europe/Lisbon', 'Europe/Athens', 'Africa/Lagos', 'Africa/Nairobi', 'Africa/Johannesburg', 'Asia/Kolkata', 'Asia/Tokyo', 'Asia/Singapore', 'Australia/Sydney', 'Pacific/Auckland'];

function prng(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

type Rand = () => number;
const pick = <T>(rand: Rand, list: readonly T[]): T => list[Math.floor(rand() * list.length)];
const pickSome = <T>(rand: Rand, list: readonly T[], min: number, max: number): T[] => {
  const n = min + Math.floor(rand() * (max - min + 1));
  return [...new Set(Array.from({ length: n }, () => pick(rand, list)))];
};
const capital = (s: string) => s.charAt(0).toUpperCase() + s.slice(1);
const word = (rand: Rand, syllables: number) => capital(Array.from({ length: syllables }, () => pick(rand, SYLLABLES)).join(''));

export function inventDrummer(rand: Rand): { displayName: string; profile: DrummerProfileInput } {
  const styles = pickSome(rand, DRUM_STYLES, 1, 4);
  const currency = rand() < 0.5 ? 'USD' : pick(rand, RATE_CURRENCIES);
  const major = 50 + Math.floor(rand() * 551);
  // JPY has no minor unit: a yen rate is a whole number of yen, about a hundredfold the dollar figure.
  const baseRateMinor = currency === 'JPY' ? major * 150 : major * 100;
  return {
    displayName: `${word(rand, 2)} ${word(rand, 2 + Math.floor(rand() * 2))}`,
    profile: {
      headline: `${capital(pick(rand, ADJECTIVES))} ${styles[0].replace(/-/g, ' ')} drummer ${pick(rand, PHRASES)}`,
      bio: pickSome(rand, SENTENCES, 2, 4).join(' '),
      styles,
      tags: pickSome(rand, TAGS, 0, 3),
      kit: pickSome(rand, KIT_PARTS, 4, 8).join(', '),
      baseRateMinor,
      currency,
      turnaroundDays: 1 + Math.floor(rand() * 21),
      revisionsIncluded: Math.floor(rand() * 4),
      takingWork: rand() < 0.8,
      town: word(rand, 3),
      country: '',
      timeZone: pick(rand, ZONES),
      // A few drafts, so the "published" rule is part of every measured query.
      published: rand() < 0.95,
    },
  };
}

export function countLargeDrummers(db: Db): number {
  return db.select({ n: sql<number>`count(*)` }).from(users).where(like(users.email, `%@${LARGE_EMAIL_DOMAIN}`)).get()?.n ?? 0;
}

/** Adds invented drummers until DATA_DIR holds `count` of them; returns how many it made. */
export async function seedLarge(dataDir: string, count = 10_000, password = 'kitlane-demo-pass'): Promise<{ made: number; total: number; ms: number }> {
  const started = performance.now();
  const db = openDb(join(resolve(dataDir), 'kitlane.db'));
  try {
    applyMigrations(db);
    const existing = countLargeDrummers(db);
    if (existing >= count) return { made: 0, total: existing, ms: performance.now() - started };
    const passwordHash = await hashPassword(password);
    const profilesRepo = createProfilesRepository(db);
    const profiles = createProfilesService({ db, repo: profilesRepo, reels: createReelsRepository(db) });
    const rand = prng(20_260_101 + existing);
    const now = new Date();
    const addOne = (i: number) => {
      const { displayName, profile } = inventDrummer(rand);
      const id = randomUUID();
      const email = `drummer-${String(i + 1).padStart(5, '0')}@${LARGE_EMAIL_DOMAIN}`;
      db.insert(users).values({ id, email, displayName, passwordHash, roles: ['drummer'], emailVerifiedAt: now, timeZone: profile.timeZone, createdAt: now }).run();
      profiles.saveOwnDrummer({ id, email, displayName, roles: ['drummer'], emailVerified: true, timeZone: profile.timeZone }, profile);
    };
    // Batches of 500 in one transaction each (the service's own transaction becomes a savepoint): one
    // commit per drummer would spend most of the time waiting for the disk.
    const batch = db.$client.transaction((from: number, to: number) => {
      for (let i = from; i < to; i++) addOne(i);
    });
    for (let from = existing; from < count; from += 500) batch(from, Math.min(count, from + 500));
    db.$client.pragma('optimize');
    return { made: count - existing, total: count, ms: performance.now() - started };
  } finally {
    db.$client.close();
  }
}

function argValue(name: string): string | undefined {
  const i = process.argv.indexOf(name);
  return i >= 0 ? process.argv[i + 1] : undefined;
}

if (process.argv[1] && import.meta.url === pathToFileURL(resolve(process.argv[1])).href) {
  const dataDir = argValue('--dir') ?? process.env.DATA_DIR ?? LARGE_DEFAULT_DIR;
  const count = Number(argValue('--count') ?? 10_000);
  const result = await seedLarge(dataDir, count, process.env.DEMO_PASSWORD);
  console.log(`seed:large → ${resolve(dataDir)}: made ${result.made}, ${result.total} invented drummers in all (${(result.ms / 1000).toFixed(1)} s)`);
}
