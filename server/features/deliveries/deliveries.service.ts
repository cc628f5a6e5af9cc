// Stem deliveries (issue 5): who may create, upload, submit, review, accept and download, the states a
// delivery moves through, and the background work (previews per file, the check per delivery).
import { randomUUID } from 'node:crypto';
import { mkdir, rename } from 'node:fs/promises';
import { createReadStream } from 'node:fs';
import { dirname } from 'node:path';
import { eq } from 'drizzle-orm';
import type { AppContext } from '../../app';
import type { CurrentUser } from '../../auth/middleware';
import type { Db } from '../../db/client';
import { deliveries, deliveryFiles, deliveryNotes } from '../../db/schema';
import { AppError, conflict, forbidden, notFound } from '../../http/app-error';
import { can } from '@shared/permissions';
import { suggestPart } from '@shared/stems/parts';
import type { BookingStatus } from '@shared/schemas/bookings';
import type { DeliveryCheckReport } from '@shared/schemas/delivery-check';
import type {
  DeliveryFileInput,
  DeliveryFileView,
  DeliveryInput,
  DeliveryListView,
  DeliveryNoteInput,
  DeliveryNoteView,
  DeliveryView,
  RequestChangesInput,
  RequestChangesResult,
} from '@shared/schemas/deliveries';
import { inTransaction } from '../briefs/in-transaction';
import { transitionBooking } from '../bookings/bookings.service';
import { createBookingsRepository, type BookingRow } from '../bookings/bookings.repository';
import { deliveriesRepo as repo, type DeliveryFileRow, type DeliveryNoteRow, type DeliveryRow } from './deliveries.repository';
import type { DeliverySettings } from './deliveries.config';
import { inputListStems } from './check-expect';
import type { MoneySeam } from './money-seam';

export const CHECK_JOB = 'deliveries.check';
export const PREVIEW_JOB = 'deliveries.preview';

/** Booking states in which stems may be delivered (DESIGN.md lifecycle). */
const DELIVERABLE: BookingStatus[] = ['funded', 'recording', 'changes_requested'];

type Role = 'songwriter' | 'drummer' | 'engineer' | 'admin';

function roleIn(booking: BookingRow, user: CurrentUser): Role | null {
  if (booking.songwriterId === user.id) return 'songwriter';
  if (booking.drummerId === user.id) return 'drummer';
  if (booking.engineerId === user.id) return 'engineer';
  return can(user.roles, 'read:booking:any') ? 'admin' : null;
}

const isUploader = (role: Role | null, user: CurrentUser) => (role === 'drummer' || role === 'engineer') && can(user.roles, 'create:delivery:own');

export const storageKeys = {
  original: (deliveryId: string, fileId: string) => `deliveries/${deliveryId}/originals/${fileId}.wav`,
  preview: (deliveryId: string, fileId: string) => `deliveries/${deliveryId}/previews/${fileId}.mp3`,
  peaks: (deliveryId: string, fileId: string) => `deliveries/${deliveryId}/peaks/${fileId}.json`,
};

/** Report paths are the server's own; the stored report names files by their uploaded names only. */
export function publicReport(report: DeliveryCheckReport): DeliveryCheckReport {
  return {
    ...report,
    stems: report.stems.map((s) => ({ ...s, file: s.name, peaksFile: null })),
    unreadable: report.unreadable.map((u) => ({ ...u, file: u.name })),
  };
}

export type Loaded = { delivery: DeliveryRow; booking: BookingRow; role: Role };

export function createDeliveriesService(ctx: AppContext, deps: { settings: DeliverySettings; money: MoneySeam }) {
  const { db, storage, notifications, jobs } = ctx;
  const { settings, money } = deps;
  const bookingsRepo = createBookingsRepository(db);

  // ── Access ────────────────────────────────────────────────────────────────────────────────────────

  function visibleBooking(tx: Db, user: CurrentUser, bookingId: string): { booking: BookingRow; role: Role } {
    const booking = bookingsRepo.findById(bookingId, tx);
    const role = booking ? roleIn(booking, user) : null;
    if (!booking || !role) throw notFound('That booking');
    return { booking, role };
  }

  /** Outsiders, and songwriters before a delivery is submitted, get the same 404 as for nothing at all. */
  function visibleDelivery(tx: Db, user: CurrentUser, deliveryId: string): Loaded {
    const delivery = repo.delivery(tx, deliveryId);
    if (!delivery) throw notFound('That delivery');
    const booking = bookingsRepo.findById(delivery.bookingId, tx);
    const role = booking ? roleIn(booking, user) : null;
    if (!booking || !role) throw notFound('That delivery');
    if (role === 'songwriter' && !delivery.submittedAt) throw notFound('That delivery');
    return { delivery, booking, role };
  }

  function assertUploader(user: CurrentUser, loaded: { role: Role }): void {
    if (!isUploader(loaded.role, user)) throw forbidden('Only the booking’s drummer or engineer delivers stems');
  }

  function assertOpenForFiles(loaded: Loaded): void {
    if (loaded.delivery.submittedAt) throw conflict('delivery_submitted', 'This delivery was submitted; start a new version for changes');
    if (!DELIVERABLE.includes(loaded.booking.status)) throw conflict('booking_state', `Stems cannot be delivered on a ${loaded.booking.status.replace('_', ' ')} booking`);
  }

  function fileOf(tx: Db, loaded: Loaded, fileId: string): DeliveryFileRow {
    const file = repo.file(tx, fileId);
    if (!file || file.deliveryId !== loaded.delivery.id) throw notFound('That file');
    return file;
  }

  function originalsUnlocked(tx: Db, loaded: Loaded): boolean {
    if (loaded.role !== 'songwriter') return true;
    if (!loaded.delivery.submittedAt) return false;
    if (loaded.delivery.decision === 'accepted') return true;
    // Accepted automatically at the end of the review window, or released/split by an admin.
    const outcome = money.outcome(tx, loaded.booking.id);
    const latest = repo.latestSubmitted(tx, loaded.booking.id);
    return (outcome === 'release' || outcome === 'split') && latest?.id === loaded.delivery.id;
  }

  // ── Views ─────────────────────────────────────────────────────────────────────────────────────────

  function fileView(f: DeliveryFileRow): DeliveryFileView {
    return {
      id: f.id,
      name: f.name,
      part: f.part,
      suggestedPart: suggestPart(f.name),
      sizeBytes: f.sizeBytes,
      status: f.status,
      sha256: f.sha256,
      previewStatus: f.previewStatus,
      hasPeaks: !!f.peaksKey,
      position: f.position,
      uploadedAt: f.uploadedAt?.toISOString() ?? null,
    };
  }

  function noteView(n: DeliveryNoteRow, names: Map<string, string>): DeliveryNoteView {
    return {
      id: n.id,
      atSec: n.atSec,
      fileId: n.fileId,
      body: n.body,
      author: { id: n.authorId, displayName: names.get(n.authorId) ?? 'Unknown' },
      requestedAt: n.requestedAt?.toISOString() ?? null,
      createdAt: n.createdAt.toISOString(),
    };
  }

  function unreadableCount(tx: Db, delivery: DeliveryRow): number {
    if (delivery.checkStatus !== 'done') return 0;
    return repo.checkOfRun(tx, delivery.id, delivery.checkRun)?.report.unreadable.length ?? 0;
  }

  function submitBlockedBy(tx: Db, delivery: DeliveryRow, files: DeliveryFileRow[]): string | null {
    if (delivery.submittedAt) return 'This delivery was submitted.';
    if (files.length === 0) return 'Add the stems first.';
    if (files.some((f) => f.status !== 'uploaded')) return 'Wait until every file is uploaded.';
    if (delivery.status !== 'ready') return 'Wait until the check has finished.';
    const unreadable = unreadableCount(tx, delivery);
    if (unreadable > 0) return `Remove or replace the ${unreadable === 1 ? 'file that cannot' : `${unreadable} files that cannot`} be read.`;
    return null;
  }

  function toView(tx: Db, user: CurrentUser, loaded: Loaded): DeliveryView {
    const { delivery: d, booking, role } = loaded;
    const files = repo.files(tx, d.id);
    const notes = repo.notes(tx, [d.id]);
    const check = repo.checkOfRun(tx, d.id, d.checkRun);
    const names = repo.names(tx, [d.createdById, ...notes.map((n) => n.authorId)]);
    const uploader = isUploader(role, user);
    const songwriterTurn = role === 'songwriter' && !!d.submittedAt && d.decision === null && booking.status === 'delivered';
    const blocked = submitBlockedBy(tx, d, files);
    const unlocked = originalsUnlocked(tx, loaded);
    return {
      id: d.id,
      bookingId: d.bookingId,
      number: d.number,
      status: d.status,
      note: d.note,
      decision: d.decision,
      submittedAt: d.submittedAt?.toISOString() ?? null,
      decidedAt: d.decidedAt?.toISOString() ?? null,
      createdAt: d.createdAt.toISOString(),
      createdBy: { id: d.createdById, displayName: names.get(d.createdById) ?? 'Unknown' },
      files: files.map(fileView),
      check: {
        status: d.checkStatus,
        progress: d.checkProgress,
        label: d.checkLabel,
        error: d.checkError,
        report: d.checkStatus === 'done' && check ? check.report : null,
      },
      notes: notes.map((n) => noteView(n, names)),
      originalsUnlocked: unlocked,
      can: {
        upload: uploader && !d.submittedAt && DELIVERABLE.includes(booking.status),
        submit: uploader && blocked === null && DELIVERABLE.includes(booking.status),
        note: songwriterTurn,
        requestChanges: songwriterTurn,
        accept: songwriterTurn && can(user.roles, 'accept:delivery:own'),
        downloadOriginals: unlocked && files.some((f) => f.status === 'uploaded'),
      },
      submitBlockedBy: uploader ? blocked : null,
      maxFileBytes: settings.maxFileBytes,
      maxFiles: settings.maxFiles,
    };
  }

  function viewOf(user: CurrentUser, deliveryId: string): DeliveryView {
    return toView(db, user, visibleDelivery(db, user, deliveryId));
  }

  function createBlockedBy(tx: Db, booking: BookingRow): string | null {
    if (!DELIVERABLE.includes(booking.status)) {
      return booking.status === 'awaiting_payment' ? 'Stems can be delivered once the booking is paid.' : `Stems cannot be delivered on a ${booking.status.replace('_', ' ')} booking.`;
    }
    if (repo.openDelivery(tx, booking.id)) return 'A delivery is still open: finish and submit it first.';
    if (booking.status === 'changes_requested' && money.needsAddOnPayment(booking.id)) {
      return 'The songwriter asked for more revisions than the quote includes; the next version starts once the extra revision is paid.';
    }
    return null;
  }

  // ── Background work ───────────────────────────────────────────────────────────────────────────────

  /** Starts a fresh check run when every file is in; any older run's result will be ignored. */
  function maybeStartCheck(tx: Db, deliveryId: string): void {
    const d = repo.delivery(tx, deliveryId);
    if (!d || d.submittedAt) return;
    const files = repo.files(tx, deliveryId);
    const run = d.checkRun + 1;
    if (files.length === 0 || files.some((f) => f.status !== 'uploaded')) {
      repo.updateDelivery(tx, deliveryId, { status: 'uploading', checkRun: run, checkStatus: 'waiting', checkProgress: 0, checkLabel: '', checkError: null });
      return;
    }
    repo.updateDelivery(tx, deliveryId, { status: 'checking', checkRun: run, checkStatus: 'waiting', checkProgress: 0, checkLabel: 'Waiting to start', checkError: null });
    jobs.enqueue(CHECK_JOB, { deliveryId, run }, { dedupeKey: `delivery-check:${deliveryId}:${run}`, maxAttempts: 3 }, tx);
  }

  /** `checking → ready` once the current run's report is in and no preview is still being made. */
  function maybeReady(tx: Db, deliveryId: string): void {
    const d = repo.delivery(tx, deliveryId);
    if (!d || d.status !== 'checking' || d.checkStatus !== 'done') return;
    const files = repo.files(tx, deliveryId);
    if (files.some((f) => f.previewStatus === 'pending')) return;
    repo.updateDelivery(tx, deliveryId, { status: 'ready' });
    if (!d.submittedAt) {
      for (const uploader of new Set([d.createdById])) {
        notifications.notify(uploader, { kind: 'delivery', title: `Delivery v${d.number} is checked`, body: 'The check report is ready; submit the delivery for review when it looks right.', link: `/deliveries/${d.id}`, inAppOnly: true }, tx);
      }
    }
  }

  return {
    visibleDelivery,
    viewOf,

    list(user: CurrentUser, bookingId: string): DeliveryListView {
      const { booking, role } = visibleBooking(db, user, bookingId);
      const rows = repo.forBooking(db, bookingId).filter((d) => role !== 'songwriter' || d.submittedAt);
      const blocked = isUploader(role, user) ? createBlockedBy(db, booking) : 'Only the booking’s drummer or engineer delivers stems.';
      return {
        items: rows.map((d) => toView(db, user, { delivery: d, booking, role })).reverse(),
        canCreate: blocked === null,
        createBlockedBy: blocked,
        inputList: inputListStems(booking.inputList),
      };
    },

    create(user: CurrentUser, bookingId: string, input: DeliveryInput): DeliveryView {
      const id = inTransaction(db, (tx) => {
        const loaded = visibleBooking(tx, user, bookingId);
        if (!isUploader(loaded.role, user)) throw forbidden('Only the booking’s drummer or engineer delivers stems');
        const blocked = createBlockedBy(tx, loaded.booking);
        if (blocked) {
          const payment = loaded.booking.status === 'changes_requested' && money.needsAddOnPayment(bookingId);
          throw new AppError(payment ? 'add_on_unpaid' : 'cannot_deliver', blocked, payment ? 402 : 409);
        }
        if (loaded.booking.status === 'funded') transitionBooking(tx, bookingId, ['funded'], 'recording');
        const now = new Date();
        const row = tx
          .insert(deliveries)
          .values({ id: randomUUID(), bookingId, number: repo.latestNumber(tx, bookingId) + 1, note: input.note, createdById: user.id, createdAt: now, updatedAt: now })
          .returning()
          .get();
        return row.id;
      });
      return viewOf(user, id);
    },

    addFile(user: CurrentUser, deliveryId: string, input: DeliveryFileInput): DeliveryFileView {
      const file = inTransaction(db, (tx) => {
        const loaded = visibleDelivery(tx, user, deliveryId);
        assertUploader(user, loaded);
        assertOpenForFiles(loaded);
        if (input.sizeBytes > settings.maxFileBytes) {
          const gib = (settings.maxFileBytes / 1024 ** 3).toFixed(settings.maxFileBytes >= 1024 ** 3 ? 0 : 3);
          throw new AppError('too_large', `A stem can be at most ${gib} GiB`, 413, { sizeBytes: `At most ${settings.maxFileBytes} bytes` });
        }
        const files = repo.files(tx, deliveryId);
        if (files.length >= settings.maxFiles) throw new AppError('too_many_files', `A delivery holds at most ${settings.maxFiles} files`, 409);
        if (files.some((f) => f.name.toLowerCase() === input.name.toLowerCase())) {
          throw new AppError('duplicate_name', 'A file with this name is already in the delivery', 409, { name: 'Rename the file or remove the other one' });
        }
        const row = tx
          .insert(deliveryFiles)
          .values({ id: randomUUID(), deliveryId, name: input.name, part: input.part ?? suggestPart(input.name), sizeBytes: input.sizeBytes, position: repo.nextPosition(tx, deliveryId), createdAt: new Date() })
          .returning()
          .get();
        // A new file means the last check no longer covers the delivery.
        maybeStartCheck(tx, deliveryId);
        return row;
      });
      return fileView(file);
    },

    updateFile(user: CurrentUser, deliveryId: string, fileId: string, part: string | null): DeliveryFileView {
      return inTransaction(db, (tx) => {
        const loaded = visibleDelivery(tx, user, deliveryId);
        assertUploader(user, loaded);
        assertOpenForFiles(loaded);
        const file = fileOf(tx, loaded, fileId);
        if (file.part === part) return fileView(file);
        repo.updateFile(tx, fileId, { part });
        // Parts decide which stems are compared as pairs: check again.
        maybeStartCheck(tx, deliveryId);
        return fileView(repo.file(tx, fileId)!);
      });
    },

    /** Cancels an upload or removes a stem before submission; its bytes go with it. */
    async removeFile(user: CurrentUser, deliveryId: string, fileId: string, dropUpload: (fileId: string) => Promise<void>): Promise<void> {
      const file = inTransaction(db, (tx) => {
        const loaded = visibleDelivery(tx, user, deliveryId);
        assertUploader(user, loaded);
        assertOpenForFiles(loaded);
        const row = fileOf(tx, loaded, fileId);
        tx.delete(deliveryFiles).where(eq(deliveryFiles.id, fileId)).run();
        maybeStartCheck(tx, deliveryId);
        return row;
      });
      await dropUpload(file.id);
      for (const key of [file.storageKey, file.previewKey, file.peaksKey]) if (key) await storage.delete(key);
    },

    /** For the tus server: may this user send (or read the offset of) this file's bytes now? */
    authorizeUpload(user: CurrentUser, fileId: string, op: 'create' | 'write' | 'read' | 'cancel'): { sizeBytes: number } {
      const file = repo.file(db, fileId);
      if (!file) throw notFound('That upload');
      const loaded = visibleDelivery(db, user, file.deliveryId);
      assertUploader(user, loaded);
      if (op !== 'read') assertOpenForFiles(loaded);
      if (file.status === 'uploaded' && op !== 'read') throw conflict('already_uploaded', 'This file is already uploaded');
      return { sizeBytes: file.sizeBytes };
    },

    /** Runs when tus has every byte: the file moves into storage whole, or not at all. */
    async completeUpload(fileId: string, localPath: string, sha256: string): Promise<void> {
      const file = repo.file(db, fileId);
      if (!file) throw notFound('That upload');
      const key = storageKeys.original(file.deliveryId, file.id);
      await moveIntoStorage(localPath, key);
      inTransaction(db, (tx) => {
        const current = repo.file(tx, fileId);
        if (!current) return;
        repo.updateFile(tx, fileId, { status: 'uploaded', sha256, storageKey: key, uploadedAt: new Date(), previewStatus: 'pending' });
        jobs.enqueue(PREVIEW_JOB, { fileId }, { dedupeKey: `delivery-preview:${fileId}`, maxAttempts: 3 }, tx);
        maybeStartCheck(tx, file.deliveryId);
      });
    },

    submit(user: CurrentUser, deliveryId: string): DeliveryView {
      inTransaction(db, (tx) => {
        const loaded = visibleDelivery(tx, user, deliveryId);
        assertUploader(user, loaded);
        assertOpenForFiles(loaded);
        const blocked = submitBlockedBy(tx, loaded.delivery, repo.files(tx, deliveryId));
        if (blocked) throw conflict('not_ready', blocked);
        const now = new Date();
        const booking = transitionBooking(tx, loaded.booking.id, DELIVERABLE, 'delivered');
        repo.updateDelivery(tx, deliveryId, { submittedAt: now });
        money.scheduleAutoAccept(tx, booking.id, now);
        const d = loaded.delivery;
        notifications.notify(
          booking.songwriterId,
          {
            kind: 'delivery',
            title: `Stems delivered: "${booking.terms.songTitle}" v${d.number}`,
            body: `${user.displayName} delivered v${d.number}. Listen in the review room, then accept it or ask for changes.`,
            link: `/deliveries/${d.id}`,
            mailParagraphs: [
              `${user.displayName} delivered version ${d.number} of the drum stems for "${booking.terms.songTitle}".`,
              ...(d.note ? [`Their note: ${d.note}`] : []),
              'Open the review room to play the stems together, read the check report, leave notes on the timeline, and accept the delivery or ask for changes.',
            ],
          },
          tx,
        );
      });
      return viewOf(user, deliveryId);
    },

    addNote(user: CurrentUser, deliveryId: string, input: DeliveryNoteInput): DeliveryNoteView {
      return inTransaction(db, (tx) => {
        const loaded = visibleDelivery(tx, user, deliveryId);
        assertSongwriterTurn(user, loaded);
        if (input.fileId) fileOf(tx, loaded, input.fileId);
        const row = tx
          .insert(deliveryNotes)
          .values({ id: randomUUID(), deliveryId, authorId: user.id, atSec: input.atSec, fileId: input.fileId, body: input.body, createdAt: new Date() })
          .returning()
          .get();
        return noteView(row, repo.names(tx, [user.id]));
      });
    },

    removeNote(user: CurrentUser, deliveryId: string, noteId: string): void {
      inTransaction(db, (tx) => {
        const loaded = visibleDelivery(tx, user, deliveryId);
        const note = repo.note(tx, noteId);
        if (!note || note.deliveryId !== deliveryId) throw notFound('That note');
        if (note.authorId !== user.id) throw forbidden('Only its author removes a note');
        if (note.requestedAt) throw conflict('note_sent', 'This note was already sent with a request for changes');
        assertSongwriterTurn(user, loaded);
        tx.delete(deliveryNotes).where(eq(deliveryNotes.id, noteId)).run();
      });
    },

    requestChanges(user: CurrentUser, deliveryId: string, input: RequestChangesInput): RequestChangesResult {
      const outstanding = inTransaction(db, (tx) => {
        const loaded = visibleDelivery(tx, user, deliveryId);
        assertSongwriterTurn(user, loaded);
        const notes = repo.notes(tx, [deliveryId]).filter((n) => !n.requestedAt);
        if (notes.length === 0 && !input.message) {
          throw new AppError('nothing_to_change', 'Leave at least one note on the timeline, or a message, saying what should change', 400, { message: 'Say what should change' });
        }
        const now = new Date();
        const booking = transitionBooking(tx, loaded.booking.id, ['delivered'], 'changes_requested');
        // The songwriter answered: the review-window clock stops until the next version is submitted.
        money.stopAutoAccept(tx, booking.id);
        const counted = money.recordChangeRequest(tx, booking.id);
        repo.updateDelivery(tx, deliveryId, { decision: 'changes_requested', decidedAt: now, decidedById: user.id, changeMessage: input.message || null });
        for (const n of notes) tx.update(deliveryNotes).set({ requestedAt: now }).where(eq(deliveryNotes.id, n.id)).run();
        const files = new Map(repo.files(tx, deliveryId).map((f) => [f.id, f.name]));
        const list = notes.map((n) => `${formatTime(n.atSec)}${n.fileId && files.get(n.fileId) ? ` (${files.get(n.fileId)})` : ''}: ${n.body}`);
        for (const payee of new Set([booking.drummerId, ...(booking.engineerId ? [booking.engineerId] : [])])) {
          notifications.notify(
            payee,
            {
              kind: 'delivery',
              title: `Changes asked for on "${booking.terms.songTitle}" v${loaded.delivery.number}`,
              body: [input.message, ...list].filter(Boolean).join('\n'),
              link: `/deliveries/${deliveryId}`,
              mailParagraphs: [
                `${user.displayName} asked for changes to version ${loaded.delivery.number} of "${booking.terms.songTitle}".`,
                ...(input.message ? [input.message] : []),
                ...list,
                counted.addOnsOutstanding > 0
                  ? 'This goes beyond the revisions included in the quote: the next version can start once the songwriter has paid for the extra revision.'
                  : 'Upload the next version from the booking page when it is ready.',
              ],
            },
            tx,
          );
        }
        return counted.addOnsOutstanding;
      });
      return { delivery: viewOf(user, deliveryId), addOnsOutstanding: outstanding };
    },

    async accept(user: CurrentUser, deliveryId: string): Promise<DeliveryView> {
      const loaded = visibleDelivery(db, user, deliveryId);
      if (loaded.role !== 'songwriter' || !can(user.roles, 'accept:delivery:own')) throw forbidden('Only the songwriter accepts a delivery');
      assertSongwriterTurn(user, loaded);
      // The money feature moves the booking to accepted and releases the escrow in its own transaction.
      await money.releaseBooking(user, loaded.booking.id, { reason: `Delivery v${loaded.delivery.number} accepted` });
      inTransaction(db, (tx) => repo.updateDelivery(tx, deliveryId, { decision: 'accepted', decidedAt: new Date(), decidedById: user.id }));
      return viewOf(user, deliveryId);
    },

    /** The stored key of a stem's preview, peaks or original, after the access rules for that kind. */
    fileFor(user: CurrentUser, deliveryId: string, fileId: string, kind: 'preview' | 'peaks' | 'original'): { file: DeliveryFileRow; key: string } {
      const loaded = visibleDelivery(db, user, deliveryId);
      const file = fileOf(db, loaded, fileId);
      if (kind === 'original' && !originalsUnlocked(db, loaded)) throw forbidden('The original files unlock when the delivery is accepted; until then, listen to the previews');
      const key = kind === 'original' ? file.storageKey : kind === 'preview' ? file.previewKey : file.peaksKey;
      if (!key || file.status !== 'uploaded') throw notFound(kind === 'original' ? 'That file' : `That file's ${kind}`);
      return { file, key };
    },

    /** Everything the zip needs, after the same rule as single originals. */
    zipOf(user: CurrentUser, deliveryId: string): { loaded: Loaded; files: DeliveryFileRow[]; report: DeliveryCheckReport | null } {
      const loaded = visibleDelivery(db, user, deliveryId);
      if (!originalsUnlocked(db, loaded)) throw forbidden('The original files unlock when the delivery is accepted; until then, listen to the previews');
      const files = repo.files(db, deliveryId).filter((f) => f.status === 'uploaded' && f.storageKey);
      if (files.length === 0) throw notFound('Files for that delivery');
      const check = repo.checkOfRun(db, deliveryId, loaded.delivery.checkRun);
      return { loaded, files, report: check?.report ?? null };
    },

    // ── Jobs ────────────────────────────────────────────────────────────────────────────────────────
    maybeStartCheck,
    maybeReady,
  };

  function assertSongwriterTurn(user: CurrentUser, loaded: Loaded): void {
    if (loaded.role !== 'songwriter') throw forbidden('Only the songwriter reviews a delivery');
    if (loaded.delivery.decision !== null) throw conflict('already_decided', 'This delivery has already been answered');
    if (loaded.booking.status !== 'delivered') throw conflict('booking_state', `This booking is ${loaded.booking.status.replace('_', ' ')}; a delivery is reviewed while it is delivered`);
    const latest = repo.latestSubmitted(db, loaded.booking.id);
    if (latest?.id !== loaded.delivery.id) throw conflict('not_latest', 'A newer version of this delivery exists');
  }

  /** Same disk: a rename (no second copy of 4 GiB). Another driver: streamed into it. */
  async function moveIntoStorage(localPath: string, key: string): Promise<void> {
    const target = storage.localPath(key);
    if (target) {
      await mkdir(dirname(target), { recursive: true });
      try {
        await rename(localPath, target);
        return;
      } catch (error) {
        if ((error as NodeJS.ErrnoException).code !== 'EXDEV') throw error;
      }
    }
    await storage.put(key, createReadStream(localPath));
  }
}

export type DeliveriesService = ReturnType<typeof createDeliveriesService>;

export function formatTime(sec: number): string {
  const whole = Math.max(0, sec);
  const m = Math.floor(whole / 60);
  const s = whole - m * 60;
  return `${m}:${s.toFixed(1).padStart(4, '0')}`;
}
