// Demo delivery (issue 5): the payments step leaves "Salt Road" delivered without any stems. This step gives
// it a real v1 through the delivery service: eight synthesised mics of our own (server/audio/testing), each
// added, "uploaded" the way tus hands a finished file over, previewed, checked and submitted, so the review
// room has something to play on a fresh `npm start`.
import { createHash } from 'node:crypto';
import { mkdtemp, rm, writeFile } from 'node:fs/promises';
import { availableParallelism, tmpdir } from 'node:os';
import { join } from 'node:path';
import { eq } from 'drizzle-orm';
import type { AppContext } from '../../app';
import type { CurrentUser } from '../../auth/middleware';
import { users } from '../../db/schema';
import type { SeedStep } from '../../db/seed-steps';
import type { PartId } from '@shared/stems/parts';
import { buildWav, renderKit } from '../../audio/testing/synth-wav';
import { inTransaction } from '../briefs/in-transaction';
import { transitionBooking } from '../bookings/bookings.service';
import { createBookingsRepository } from '../bookings/bookings.repository';
import { readDeliverySettings } from './deliveries.config';
import { createDeliveriesService } from './deliveries.service';
import { deliveriesRepo } from './deliveries.repository';
import { deliveryWork } from './delivery-jobs';
import { moneySeam } from './money-seam';

// The short end of 20–30 s: the previews are most of the seed's time (about 1 s of encoding per stem).
const DEMO_SECONDS = 20;
// Each preview is one worker thread; more lanes than cores only makes them take turns.
const PREVIEW_LANES = Math.max(1, availableParallelism());

/** Which of the synthesised kit's mics go into the demo, under what name and part. */
const DEMO_STEMS: { from: string; name: string; part: PartId }[] = [
  { from: 'Kick In.wav', name: 'Kick In', part: 'kick_in' },
  { from: 'Kick Out.wav', name: 'Kick Out', part: 'kick_out' },
  // The synthesised bottom mic is inverted against the top, as a mic facing up is (common practice).
  { from: 'Snare Top.wav', name: 'Snare Top', part: 'snare_top' },
  { from: 'Snare Bottom.wav', name: 'Snare Bottom', part: 'snare_bottom' },
  { from: 'HH.wav', name: 'Hi-Hat', part: 'hi_hat' },
  { from: 'OH L.wav', name: 'OH L', part: 'overhead_l' },
  { from: 'OH R.wav', name: 'OH R', part: 'overhead_r' },
  { from: 'Room L.wav', name: 'Room', part: 'room_mono' },
];

function demoUser(ctx: AppContext, id: string): CurrentUser {
  const row = ctx.db.select().from(users).where(eq(users.id, id)).get();
  if (!row) throw new Error(`demo user ${id} is missing`);
  return { id: row.id, email: row.email, displayName: row.displayName, roles: row.roles, emailVerified: true, timeZone: row.timeZone };
}

/** File names carrying song, part and format (common practice for delivered multitracks). */
function stemFileName(song: string, part: string, rateHz: number, bitDepth: string): string {
  const format = `${rateHz / 1000}k${bitDepth === '32f' ? '32f' : bitDepth}`;
  return `${song.replace(/[^\p{L}\p{N} -]/gu, '').trim()} - ${part} - ${format}.wav`;
}

async function inLanes<T>(items: T[], lanes: number, work: (item: T) => Promise<void>): Promise<void> {
  const queue = [...items];
  const lane = async () => {
    for (let item = queue.shift(); item !== undefined; item = queue.shift()) await work(item);
  };
  await Promise.all(Array.from({ length: Math.min(lanes, items.length) }, lane));
}

export const deliveriesSeedStep: SeedStep = {
  name: 'deliveries: a checked v1 on the delivered demo booking',
  async run(ctx, state) {
    const bookingId = (state.moneyBookingIds as { delivered?: string } | undefined)?.delivered;
    // Without the payment fake the payments step makes no delivered booking, and there is nothing to deliver.
    if (!bookingId) return;
    const booking = createBookingsRepository(ctx.db).findById(bookingId);
    if (!booking || booking.status !== 'delivered') return;

    const settings = readDeliverySettings();
    const money = moneySeam(ctx);
    const service = createDeliveriesService(ctx, { settings, money });
    const work = deliveryWork(ctx, service, settings);
    const drummer = demoUser(ctx, booking.drummerId);

    // The payments step stood in for a delivery by moving the booking to delivered; take that back so the
    // real delivery goes through the same states as one a drummer makes (submitting restarts the clock).
    inTransaction(ctx.db, (tx) => {
      money.stopAutoAccept(tx, bookingId);
      transitionBooking(tx, bookingId, ['delivered'], 'recording');
    });

    const { sampleRate, bitDepth } = booking.terms.deliverables;
    const delivery = service.create(drummer, bookingId, { note: 'First pass: close mics, overheads and a mono room, no processing.' });
    const kit = renderKit({ sampleRate, seconds: DEMO_SECONDS, tempo: booking.terms.tempoBpm, seed: 2026 });
    const scratch = await mkdtemp(join(tmpdir(), 'kitlane-demo-stems-'));
    try {
      for (const stem of DEMO_STEMS) {
        const samples = kit.find((k) => k.name === stem.from)?.samples;
        if (!samples) throw new Error(`the synthesised kit has no ${stem.from}`);
        const bytes = bitDepth === '32f' ? buildWav([samples], { sampleRate, encoding: 'float', bits: 32 }) : buildWav([samples], { sampleRate, bits: Number(bitDepth) });
        const file = service.addFile(drummer, delivery.id, { name: stemFileName(booking.terms.songTitle, stem.name, sampleRate, bitDepth), sizeBytes: bytes.length, part: stem.part });
        const path = join(scratch, `${file.id}.wav`);
        await writeFile(path, bytes);
        // What tus calls when the last byte is in: the file moves into storage and the jobs are queued.
        await service.completeUpload(file.id, path, createHash('sha256').update(bytes).digest('hex'));
      }
    } finally {
      await rm(scratch, { recursive: true, force: true });
    }

    // Run the queued work now (it takes a few seconds for 8 short stems) so the demo opens submitted.
    const files = service.viewOf(drummer, delivery.id).files;
    await inLanes(files, PREVIEW_LANES, (f) => work.preview({ fileId: f.id }, { attempt: 1 }));
    const run = deliveriesRepo.delivery(ctx.db, delivery.id)?.checkRun ?? 0;
    await work.check({ deliveryId: delivery.id, run }, { attempt: 1 });
    service.submit(drummer, delivery.id);
  },
};
