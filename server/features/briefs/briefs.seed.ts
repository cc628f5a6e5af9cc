import { eq } from 'drizzle-orm';
import { randomUUID } from 'node:crypto';
import { createReadStream } from 'node:fs';
import { rm, stat, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { AppContext } from '../../app';
import type { CurrentUser } from '../../auth/middleware';
import { users } from '../../db/schema';
import type { SeedState, SeedStep } from '../../db/seed-steps';
import type { Storage } from '../../storage/storage';
import type { ReceivedFile } from '../../uploads/receive';
import { briefInputSchema, todayIn, type BriefInput } from '@shared/schemas/briefs';
import { quoteInputSchema, type QuoteInput } from '@shared/schemas/quotes';
import { createQuotesService } from '../quotes/quotes.service';
import { createBriefsService } from './briefs.service';
import { guideWav } from './guide-synth';

// The demo's briefs and quotes, made through the same services people use. Every guide track is
// synthesised here (a click over a bass-like tone, 12–16 s of 16-bit mono), so nothing is borrowed.

type DemoBrief = {
  key: string;
  owner: string;
  brief: Omit<BriefInput, 'deadline'> & { deadlineInDays: number };
  guide: { seconds: number; rootHz: number };
  invite: string[];
  quotes: { drummer: string; quote: QuoteInput; engineer?: string }[];
  accept?: string;
};

const DEMO_BRIEFS: DemoBrief[] = [
  {
    key: 'paper-lanterns',
    owner: 'mara',
    brief: {
      songTitle: 'Paper Lanterns',
      description: 'A bright indie song about a street festival; acoustic guitars, bass and two vocals are done.',
      drumNotes: 'Brushes or hot rods in the verses, full kit from the second chorus; keep the hats moving.',
      style: 'indie',
      tempoBpm: 118,
      timeSignature: '4/4',
      musicalKey: 'D major',
      lengthBars: 88,
      lengthSeconds: null,
      songCount: 1,
      referenceNotes: 'Warm and roomy rather than tight and dry.',
      sampleRate: 48000,
      bitDepth: '24',
      stemMode: 'every_mic',
      roughMix: true,
      budgetMinMinor: 15000,
      budgetMaxMinor: 40000,
      currency: 'GBP',
      deadlineInDays: 28,
      needsRoom: false,
    },
    guide: { seconds: 14, rootHz: 73.42 },
    invite: ['juno'],
    quotes: [
      {
        drummer: 'juno',
        quote: { perSongFeeMinor: 18000, rushFeeMinor: 0, extraRevisionMinor: 4000, revisionsIncluded: 2, turnaroundDays: 5, rightsTerms: 'credit', message: 'Love the brushes idea for the verses. I can send a brushes take and a sticks take.', validDays: 21 },
      },
      {
        drummer: 'kofi',
        quote: { perSongFeeMinor: 14000, rushFeeMinor: 0, extraRevisionMinor: 3000, revisionsIncluded: 1, turnaroundDays: 8, rightsTerms: 'buyout', message: 'Happy to keep it loose and roomy.', validDays: 14 },
      },
    ],
  },
  {
    key: 'low-tide-motel',
    owner: 'teo',
    brief: {
      songTitle: 'Low Tide Motel',
      description: 'A slow soul ballad; keys, bass and vocal are tracked to a click.',
      drumNotes: 'Laid back behind the beat, ghost notes on the snare, a big fill into the last chorus only.',
      style: 'soul',
      tempoBpm: 72,
      timeSignature: '12/8',
      musicalKey: 'B♭ major',
      lengthBars: null,
      lengthSeconds: 245,
      songCount: 1,
      referenceNotes: 'Dry, close sound; a little room on the overheads is fine.',
      sampleRate: 48000,
      bitDepth: '24',
      stemMode: 'named',
      stemList: ['Kick', 'Snare', 'Hi-hat', 'Toms', 'Overheads', 'Room'],
      roughMix: false,
      budgetMinMinor: 20000,
      budgetMaxMinor: 50000,
      currency: 'USD',
      deadlineInDays: 21,
      needsRoom: false,
    },
    guide: { seconds: 16, rootHz: 58.27 },
    invite: ['odell'],
    quotes: [
      {
        drummer: 'odell',
        quote: { perSongFeeMinor: 26000, rushFeeMinor: 0, extraRevisionMinor: 5000, revisionsIncluded: 3, turnaroundDays: 4, rightsTerms: 'buyout', message: 'This is right in my pocket. Dry set plus a roomier set.', validDays: 14 },
      },
      {
        drummer: 'lux',
        quote: { perSongFeeMinor: 30000, rushFeeMinor: 0, extraRevisionMinor: 6000, revisionsIncluded: 2, turnaroundDays: 6, rightsTerms: 'points', royaltyPoints: 1, message: 'I would love to play on this one.', validDays: 10 },
      },
    ],
    accept: 'odell',
  },
  {
    key: 'glasshouse',
    owner: 'ines',
    brief: {
      songTitle: 'Glasshouse',
      description: 'An electronic-leaning pop song that needs real drums under the programmed loop in the choruses.',
      drumNotes: 'Four on the floor in the choruses, tom patterns in the verses; no crash cymbals, please.',
      style: 'pop',
      tempoBpm: 104,
      timeSignature: '4/4',
      musicalKey: 'F♯ minor',
      lengthBars: 104,
      lengthSeconds: null,
      songCount: 2,
      referenceNotes: 'Both songs share the tempo and kit sound; the second one is an alternate arrangement.',
      sampleRate: 96000,
      bitDepth: '32f',
      stemMode: 'every_mic',
      roughMix: true,
      budgetMinMinor: 40000,
      budgetMaxMinor: 120000,
      currency: 'EUR',
      deadlineInDays: 35,
      needsRoom: true,
    },
    guide: { seconds: 12, rootHz: 92.5 },
    invite: ['pim', 'wren'],
    quotes: [
      {
        drummer: 'pim',
        engineer: 'rune',
        quote: { perSongFeeMinor: 22000, rushFeeMinor: 0, extraRevisionMinor: 5000, revisionsIncluded: 2, turnaroundDays: 10, rightsTerms: 'credit', message: 'I would track at a local room with its engineer; the package price is theirs.', validDays: 21 },
      },
    ],
  },
  {
    // Stays awaiting payment in the demo (the payments step funds the first booking only).
    key: 'chalk-hill',
    owner: 'mara',
    brief: {
      songTitle: 'Chalk Hill',
      description: 'A short folk-rock song; guitar, bass and vocal are done.',
      drumNotes: 'Floor-tom heavy verses, a straight backbeat in the chorus.',
      style: 'folk',
      tempoBpm: 132,
      timeSignature: '4/4',
      musicalKey: 'G major',
      lengthBars: 72,
      lengthSeconds: null,
      songCount: 1,
      referenceNotes: 'Roomy, a bit rough around the edges.',
      sampleRate: 44100,
      bitDepth: '24',
      stemMode: 'every_mic',
      roughMix: false,
      budgetMinMinor: 10000,
      budgetMaxMinor: 25000,
      currency: 'GBP',
      deadlineInDays: 18,
      needsRoom: false,
    },
    guide: { seconds: 10, rootHz: 98 },
    invite: ['kofi'],
    quotes: [
      {
        drummer: 'kofi',
        quote: { perSongFeeMinor: 16000, rushFeeMinor: 0, extraRevisionMinor: 3000, revisionsIncluded: 2, turnaroundDays: 5, rightsTerms: 'credit', message: 'Floor toms are my favourite thing.', validDays: 14 },
      },
    ],
    accept: 'kofi',
  },
];

function demoUser(ctx: AppContext, id: string): CurrentUser {
  const row = ctx.db.select().from(users).where(eq(users.id, id)).get();
  if (!row) throw new Error(`demo user ${id} is missing`);
  return { id: row.id, email: row.email, displayName: row.displayName, roles: row.roles, emailVerified: row.emailVerifiedAt != null, timeZone: row.timeZone };
}

function addDays(date: string, days: number): string {
  const [y, m, d] = date.split('-').map(Number);
  return new Date(Date.UTC(y, m - 1, d + days)).toISOString().slice(0, 10);
}

/** A synthesised guide as if it had just been received by the upload route. */
async function receivedGuide(demo: DemoBrief): Promise<ReceivedFile> {
  const tmpPath = join(tmpdir(), `kitlane-seed-${randomUUID()}.wav`);
  await writeFile(tmpPath, guideWav({ seconds: demo.guide.seconds, tempoBpm: demo.brief.tempoBpm, rootHz: demo.guide.rootHz, sampleRate: 22050 }));
  const discard = () => rm(tmpPath, { force: true });
  return {
    tmpPath,
    originalName: `${demo.key}-guide.wav`,
    size: (await stat(tmpPath)).size,
    kind: 'wav',
    mime: 'audio/wav',
    fields: {},
    async saveTo(storage: Storage, key: string) {
      try {
        await storage.put(key, createReadStream(tmpPath));
      } finally {
        await discard();
      }
    },
    discard,
  };
}

/** The engineer's first mic package when the rooms step made one, else the engineer and a share by hand. */
function engineerPart(state: SeedState, engineerKey: string): Partial<QuoteInput> {
  const packageId = (state.micPackageIds as Record<string, string[]> | undefined)?.[engineerKey]?.[0];
  return packageId ? { packageId } : { engineerId: state.userIds[engineerKey], engineerShareMinor: 15000 };
}

async function seedBrief(ctx: AppContext, state: SeedState, demo: DemoBrief): Promise<{ briefId: string; bookingId: string | null }> {
  const briefs = createBriefsService(ctx);
  const quotes = createQuotesService(ctx);
  const ids = state.userIds;
  const owner = demoUser(ctx, ids[demo.owner]);
  const { deadlineInDays, ...fields } = demo.brief;
  const input = briefInputSchema.parse({ ...fields, deadline: addDays(todayIn(owner.timeZone), deadlineInDays) });
  const draft = briefs.create(owner, input);
  await briefs.attachGuide(owner, draft.id, () => receivedGuide(demo));
  briefs.publish(owner, draft.id);
  briefs.invite(owner, draft.id, demo.invite.map((k) => ids[k]));
  const quoteIds: Record<string, string> = {};
  for (const q of demo.quotes) {
    const engineer = q.engineer ? engineerPart(state, q.engineer) : {};
    const quote = quotes.create(demoUser(ctx, ids[q.drummer]), draft.id, quoteInputSchema.parse({ ...q.quote, ...engineer }));
    quoteIds[q.drummer] = quote.id;
  }
  const booking = demo.accept ? quotes.accept(owner, quoteIds[demo.accept]) : null;
  return { briefId: draft.id, bookingId: booking?.id ?? null };
}

export const briefsSeedStep: SeedStep = {
  name: 'briefs, quotes and one booking',
  async run(ctx, state) {
    const briefIds: Record<string, string> = {};
    const bookingIds: string[] = [];
    for (const demo of DEMO_BRIEFS) {
      const { briefId, bookingId } = await seedBrief(ctx, state, demo);
      briefIds[demo.key] = briefId;
      if (bookingId) bookingIds.push(bookingId);
    }
    // Later steps (message threads) start conversations on these.
    state.briefIds = briefIds;
    state.bookingIds = bookingIds;
  },
};
