import type { AppContext } from '../../app';
import type { CurrentUser } from '../../auth/middleware';
import type { SeedStep } from '../../db/seed-steps';
import { createMessagesRepository, type MessagesRepository } from './messages.repository';
import { createMessagesService, type MessagesService } from './messages.service';
import type { DigestScheduler } from './messages.digest';

type Line = { from: 'songwriter' | 'drummer' | 'engineer'; body: string; minutesAgo: number };

// Invented demo conversations in the trade's everyday words; each ends with the other side's message
// so the demo songwriter signs in to an unread badge.
const BRIEF_TALKS: Line[][] = [
  [
    { from: 'drummer', body: 'Thanks for the guide track — the click is clear. Before the chorus, do you want the fills kept sparse, or should I build into it?', minutesAgo: 300 },
    { from: 'songwriter', body: 'Build into it, but keep the verses tight. The drum loop in the demo is only a placeholder.', minutesAgo: 260 },
    { from: 'drummer', body: 'Got it. I would track a fairly dry kit with a little room. I can send a rough take of the first chorus with my quote.', minutesAgo: 45 },
  ],
  [
    { from: 'songwriter', body: 'Hi! I liked the brushes track on your reel. Could that feel work on the second verse of this one?', minutesAgo: 500 },
    { from: 'drummer', body: 'Yes — brushes on verse two, sticks from the pre-chorus on. Is the tempo fixed, or can the bridge breathe a little?', minutesAgo: 120 },
  ],
  [
    { from: 'drummer', body: 'Quick question on the deliverables: is 48 kHz / 24-bit fine, with every mic as its own stem plus a rough mix?', minutesAgo: 90 },
  ],
];

const BOOKING_TALK: Line[] = [
  { from: 'songwriter', body: 'The booking is confirmed on my side. Anything you need before you start?', minutesAgo: 200 },
  { from: 'drummer', body: 'A tempo map if the bridge moves; otherwise the guide is all I need. I will post a first pass within the agreed turnaround.', minutesAgo: 150 },
  { from: 'engineer', body: 'I will print a rough mix alongside the stems, all files from the same start point.', minutesAgo: 30 },
];

// The seed writes history, not news: no digests are scheduled for it.
const noDigests: DigestScheduler = { schedule() {} };

function seedUser(repo: MessagesRepository, id: string): CurrentUser | null {
  const row = repo.findUser(id);
  if (!row) return null;
  return { id: row.id, email: row.email, displayName: row.displayName, roles: row.roles, emailVerified: true, timeZone: 'UTC' };
}

async function play(service: MessagesService, threadId: string, lines: Line[], people: Partial<Record<Line['from'], CurrentUser | null>>): Promise<number> {
  let sent = 0;
  for (const line of lines) {
    const who = people[line.from];
    if (!who) continue;
    await service.sendMessage(who, threadId, { body: line.body }, { sentAt: new Date(Date.now() - line.minutesAgo * 60_000), digest: false });
    sent += 1;
  }
  return sent;
}

/**
 * Demo conversations on the briefs (and bookings) the brief and quote steps created before this one. It
 * looks them up at run time and does nothing when there are none yet, so it never depends on their order
 * of arrival in the codebase.
 */
export const messagesSeedStep: SeedStep = {
  name: 'messages',
  async run(ctx: AppContext, state) {
    const repo = createMessagesRepository(ctx.db);
    const service = createMessagesService({ db: ctx.db, repo, storage: ctx.storage, digests: noDigests, logger: ctx.logger });
    const fallbackDrummers = ['juno', 'odell', 'sada'].map((k) => state.userIds[k]).filter((id): id is string => !!id);
    let threads = 0;
    let messages = 0;

    const briefs = repo.talkableBriefs(BRIEF_TALKS.length);
    for (const [i, brief] of briefs.entries()) {
      const songwriter = seedUser(repo, brief.songwriterId);
      const drummerId = brief.quotedBy[0] ?? fallbackDrummers[i % Math.max(1, fallbackDrummers.length)];
      if (!songwriter || !drummerId) continue;
      const thread = service.openBriefThread(songwriter, brief.id, { drummerId });
      messages += await play(service, thread.id, BRIEF_TALKS[i]!, { songwriter, drummer: seedUser(repo, drummerId) });
      threads += 1;
    }

    for (const booking of repo.someBookings(1)) {
      const songwriter = seedUser(repo, booking.songwriterId);
      if (!songwriter) continue;
      const thread = service.openBookingThread(songwriter, booking.id);
      const people = { songwriter, drummer: seedUser(repo, booking.drummerId), engineer: booking.engineerId ? seedUser(repo, booking.engineerId) : null };
      messages += await play(service, thread.id, BOOKING_TALK, people);
      threads += 1;
    }

    if (threads === 0) ctx.logger.info('messages seed: no published briefs or bookings yet, no demo conversations');
    state.messageThreads = threads;
    state.messages = messages;
  },
};
