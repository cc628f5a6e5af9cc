import { eq } from 'drizzle-orm';
import { writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { randomUUID } from 'node:crypto';
import type { AppContext } from '../../app';
import type { SeedStep } from '../../db/seed-steps';
import type { CurrentUser } from '../../auth/middleware';
import { users } from '../../db/schema';
import { DEMO_PEOPLE } from '../../db/demo-world';
import type { DrummerProfileInput, EngineerProfileInput } from '@shared/schemas/profiles';
import type { ReelTrackFieldsInput } from '@shared/schemas/reels';
import { createProfilesRepository } from './profiles.repository';
import { createProfilesService } from './profiles.service';
import { createReelsRepository } from '../reels/reels.repository';
import { createReelsService } from '../reels/reels.service';
import { synthReelWav, type ReelFeel } from '../reels/reel-synth';

// The demo's drummers and engineers, in our own words. Kits are described by type only; every reel track
// is synthesised here at seed time (reel-synth.ts), about 10 s of 16-bit mono, so the seed stays quick.

type DemoDrummer = Omit<DrummerProfileInput, 'town' | 'country' | 'timeZone' | 'published'> & {
  reel: (ReelTrackFieldsInput & { tempo: number; seconds: number; feel: ReelFeel })[];
};

const DRUMMERS: Record<string, DemoDrummer> = {
  juno: {
    headline: 'Loud, tight rock and indie drums with a big room sound',
    bio: 'I track in a converted rehearsal room with a high ceiling. I like songs with space to push in the chorus and pull back in the verse. Usually two takes plus a safety, comped to your notes.',
    styles: ['rock', 'indie', 'punk'],
    tags: ['big choruses', 'room mics', 'live feel'],
    kit: '22" kick, 12" rack tom, 16" floor tom, 14" steel snare; 15" hi-hats, two crashes, 21" ride. Two overheads, a mono room and a far room.',
    baseRateMinor: 18000,
    currency: 'GBP',
    turnaroundDays: 5,
    revisionsIncluded: 2,
    takingWork: true,
    reel: [
      { title: 'Straight-ahead chorus lift', style: 'rock', tempo: 128, seconds: 10, feel: 'straight' },
      { title: 'Half-time bridge', style: 'indie', tempo: 140, seconds: 9, feel: 'half-time' },
    ],
  },
  odell: {
    headline: 'Deep-pocket funk, soul and gospel grooves',
    bio: 'Ghost notes, long sixteenth-note hi-hat lines and fills that answer the vocal. I send a dry set and a roomier set so you can choose in the mix.',
    styles: ['funk', 'soul', 'gospel', 'r-and-b'],
    tags: ['ghost notes', 'pocket', 'shuffle'],
    kit: '20" kick, 10" and 12" rack toms, 14" floor tom, 14" wooden snare and a 13" piccolo; dark 14" hats, thin crashes, dry ride.',
    baseRateMinor: 25000,
    currency: 'USD',
    turnaroundDays: 4,
    revisionsIncluded: 3,
    takingWork: true,
    reel: [
      { title: 'Sunday shuffle', style: 'gospel', tempo: 92, seconds: 12, feel: 'shuffle' },
      { title: 'Pocket study', style: 'funk', tempo: 100, seconds: 10, feel: 'straight' },
    ],
  },
  sada: {
    headline: 'Jazz and fusion drummer for songs that need a light touch',
    bio: 'Brushes, sticks or mallets. I read charts and like tunes with odd bar lengths. Recorded in a small, dry room at home with close mics and a pair of overheads.',
    styles: ['jazz', 'fusion', 'pop'],
    tags: ['brushes', 'reads charts', 'odd meters'],
    kit: '18" kick, 12" rack tom, 14" floor tom, 14" brass snare; 14" hats, 20" ride with rivets, a small splash.',
    baseRateMinor: 30000,
    currency: 'JPY',
    turnaroundDays: 7,
    revisionsIncluded: 2,
    takingWork: true,
    reel: [{ title: 'Brush ballad sketch', style: 'jazz', tempo: 76, seconds: 11, feel: 'shuffle' }],
  },
  pim: {
    headline: 'Metal and punk: fast double kick, clean and edited to the grid',
    bio: 'Blast beats, double kick and tom runs. I edit to the grid or keep it human, your choice, and deliver every mic as its own stem.',
    styles: ['metal', 'punk', 'rock'],
    tags: ['double kick', 'blast beats', 'grid editing'],
    kit: 'Two 22" kicks, 10", 12" and 13" rack toms, 16" floor tom, 14" steel snare; china, stacks, three crashes.',
    baseRateMinor: 22000,
    currency: 'EUR',
    turnaroundDays: 6,
    revisionsIncluded: 2,
    takingWork: true,
    reel: [{ title: 'Four-on-the-floor rager', style: 'metal', tempo: 170, seconds: 9, feel: 'four-on-the-floor' }],
  },
  lux: {
    headline: 'Pop and electronic hybrid drums: live kit plus triggered layers',
    bio: 'Acoustic kit with pads and triggers for modern pop. I can match a programmed demo closely or replace it with a played part.',
    styles: ['pop', 'electronic', 'hip-hop'],
    tags: ['hybrid kit', 'triggers', 'tight edits'],
    kit: '22" kick, 12" rack tom, 16" floor tom, 14" aluminium snare, two pads with a trigger module; bright hats and crashes.',
    baseRateMinor: 30000,
    currency: 'USD',
    turnaroundDays: 3,
    revisionsIncluded: 1,
    // Booked up: shows how the "taking work" filter and badge look.
    takingWork: false,
    reel: [{ title: 'Club pulse', style: 'electronic', tempo: 124, seconds: 10, feel: 'four-on-the-floor' }],
  },
  kofi: {
    headline: 'Latin, reggae and world grooves with hand percussion',
    bio: 'Kit plus congas, shakers and a cajón. One-drops, steppers and clave-based patterns. Happy to add percussion layers as separate stems.',
    styles: ['latin', 'reggae', 'world', 'soul'],
    tags: ['percussion', 'one drop', 'clave'],
    kit: '20" kick, 12" rack tom, 14" floor tom, 13" timbale-style snare; cowbell, woodblock, congas, shakers.',
    baseRateMinor: 15000,
    currency: 'GBP',
    turnaroundDays: 7,
    revisionsIncluded: 2,
    takingWork: true,
    reel: [{ title: 'Steppers in the rain', style: 'reggae', tempo: 84, seconds: 12, feel: 'half-time' }],
  },
  wren: {
    headline: 'Warm folk and singer-songwriter drums, recorded in my own wooden room',
    bio: 'Soft sticks, brushes and bundle sticks. I play to the lyric and leave room for the voice. I also run the room as an engineer, so you get one person from kit to stems.',
    styles: ['folk', 'singer-songwriter', 'indie'],
    tags: ['soft sticks', 'wooden room', 'ribbon overheads'],
    kit: '20" kick, 13" rack tom, 16" floor tom, 14" wooden snare with the snares loosened; dark, thin cymbals.',
    baseRateMinor: 220000,
    currency: 'SEK',
    turnaroundDays: 8,
    revisionsIncluded: 2,
    takingWork: true,
    reel: [
      { title: 'Lantern-light waltz', style: 'folk', tempo: 90, seconds: 10, feel: 'straight' },
      { title: 'Quiet verse, brushes', style: 'singer-songwriter', tempo: 72, seconds: 9, feel: 'shuffle' },
    ],
  },
  tamsin: {
    headline: 'Country, blues and roots rock with a relaxed train beat',
    bio: 'Train beats, shuffles and slow blues. I record a full kit in a live room with a stereo room pair placed far back.',
    styles: ['country', 'blues', 'rock'],
    tags: ['train beat', 'shuffle', 'live room'],
    kit: '24" kick, 13" rack tom, 16" floor tom, 14" brass snare; 15" hats, 22" crash-ride.',
    baseRateMinor: 26000,
    currency: 'AUD',
    turnaroundDays: 5,
    revisionsIncluded: 3,
    takingWork: true,
    reel: [{ title: 'Dusty road train beat', style: 'country', tempo: 112, seconds: 10, feel: 'shuffle' }],
  },
};

const ENGINEERS: Record<string, Omit<EngineerProfileInput, 'town' | 'country' | 'timeZone'>> = {
  hollis: {
    headline: 'Drum tracking and mixing in a mid-sized live room',
    bio: 'I set up, tune and mic the kit, then track to your guide. Mixing is optional; stems always come consolidated from bar one.',
    services: ['tracking', 'mixing', 'room-hire', 'stem-prep'],
  },
  bea: {
    headline: 'Remote drum editing and stem preparation',
    bio: 'Timing edits that keep the feel, phase checks between close mics and overheads, and deliveries named and laid out the way mix engineers expect.',
    services: ['drum-editing', 'stem-prep', 'remote-sessions'],
  },
  rune: {
    headline: 'Big-room tracking and re-amping for drums',
    bio: 'A tall stone room for drums that need air. I also re-amp dry drum stems through the room so a home recording gains real space.',
    services: ['tracking', 'reamping', 'room-hire'],
  },
  wren: {
    headline: 'Small wooden room for quiet, close drum sounds',
    bio: 'I engineer my own sessions and take on other drummers who want a warm, intimate sound.',
    services: ['tracking', 'room-hire', 'remote-sessions'],
  },
};

function demoUser(ctx: AppContext, id: string): CurrentUser {
  const row = ctx.db.select().from(users).where(eq(users.id, id)).get();
  if (!row) throw new Error(`demo user ${id} is missing`);
  return { id: row.id, email: row.email, displayName: row.displayName, roles: row.roles, emailVerified: row.emailVerifiedAt != null, timeZone: row.timeZone };
}

export const profilesSeedStep: SeedStep = {
  name: 'drummer and engineer profiles with reels',
  async run(ctx, state) {
    const profilesRepo = createProfilesRepository(ctx.db);
    const reelsRepo = createReelsRepository(ctx.db);
    const profiles = createProfilesService({ db: ctx.db, repo: profilesRepo, reels: reelsRepo });
    const reels = createReelsService({ db: ctx.db, storage: ctx.storage, repo: reelsRepo, profiles: profilesRepo, logger: ctx.logger });
    let seed = 1;
    for (const person of DEMO_PEOPLE) {
      const id = state.userIds[person.key];
      const drummer = DRUMMERS[person.key];
      const engineer = ENGINEERS[person.key];
      if (!id || (!drummer && !engineer)) continue;
      const user = demoUser(ctx, id);
      const place = { town: person.town, country: person.country, timeZone: person.timeZone };
      if (drummer) {
        const { reel, ...profile } = drummer;
        profiles.saveOwnDrummer(user, { ...profile, ...place, published: true });
        for (const track of reel) {
          const tmpPath = join(tmpdir(), `kitlane-seed-${randomUUID()}.wav`);
          const wav = synthReelWav({ seconds: track.seconds, tempo: track.tempo, seed: seed++, feel: track.feel });
          await writeFile(tmpPath, wav);
          await reels.addTrack(user, { tmpPath, kind: 'wav', mime: 'audio/wav', size: wav.length }, { title: track.title, style: track.style, tempo: track.tempo });
        }
      }
      if (engineer) profiles.saveOwnEngineer(user, { ...engineer, ...place });
    }
  },
};
