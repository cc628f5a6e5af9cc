import { randomUUID } from 'node:crypto';
import type { AppContext } from '../../app';
import { assertCan, assertVerified, type CurrentUser } from '../../auth/middleware';
import { AppError, conflict, notFound } from '../../http/app-error';
import type { ReceivedFile } from '../../uploads/receive';
import {
  OPEN_BRIEFS_PAGE_SIZE,
  todayIn,
  type BriefList,
  type BriefListItem,
  type BriefValues,
  type BriefView,
  type OpenBriefsQuery,
} from '@shared/schemas/briefs';
import { inTransaction } from './in-transaction';
import { createBriefsRepository, type BriefRow } from './briefs.repository';
import { canSeeBrief, loadOwnBrief, loadVisibleBrief } from './brief-access';
import { toBriefListItem, toBriefView } from './briefs.view';
import { deleteGuideFiles, storeGuideTrack } from './guide-track';
import { declineWaitingQuotes } from '../quotes/decline-waiting';

const invalid = (field: string, message: string) => new AppError('invalid_input', message, 400, { [field]: message });

/** A deadline is a calendar date in the songwriter's zone; today there still counts, yesterday does not. */
function assertDeadlineAhead(deadline: string, timeZone: string, now: Date): void {
  if (deadline < todayIn(timeZone, now)) throw invalid('deadline', 'That deadline has already passed where you are');
}

function assertDraft(brief: BriefRow, action: string): void {
  if (brief.status !== 'draft') throw conflict('brief_not_draft', `Only a draft can be ${action}; this brief is ${brief.status}`);
}

function editableColumns(input: BriefValues) {
  return {
    songTitle: input.songTitle,
    description: input.description,
    drumNotes: input.drumNotes,
    style: input.style,
    tempoBpm: input.tempoBpm,
    timeSignature: input.timeSignature,
    musicalKey: input.musicalKey,
    lengthBars: input.lengthBars,
    lengthSeconds: input.lengthSeconds,
    songCount: input.songCount,
    referenceNotes: input.referenceNotes,
    sampleRate: input.sampleRate,
    bitDepth: input.bitDepth,
    stemMode: input.stemMode,
    // A named list only means something in named mode.
    stemList: input.stemMode === 'named' ? input.stemList : [],
    roughMix: input.roughMix,
    budgetMinMinor: input.budgetMinMinor,
    budgetMaxMinor: input.budgetMaxMinor,
    currency: input.currency,
    deadline: input.deadline,
    needsRoom: input.needsRoom,
  };
}

export function createBriefsService(ctx: Pick<AppContext, 'db' | 'storage' | 'notifications'>, clock: () => Date = () => new Date()) {
  const repo = createBriefsRepository(ctx.db);

  function view(brief: BriefRow, user: CurrentUser): BriefView {
    const isOwner = brief.songwriterId === user.id;
    const mine = isOwner ? undefined : repo.quoteOf(brief.id, user.id);
    return toBriefView(brief, {
      songwriterName: repo.userName(brief.songwriterId),
      viewer: {
        isOwner,
        invited: !isOwner && repo.isInvited(brief.id, user.id),
        myQuoteId: mine?.id ?? null,
        quoteCount: isOwner ? (repo.quoteCounts([brief.id]).get(brief.id) ?? 0) : null,
      },
      invitedDrummers: isOwner ? repo.invitedDrummers(brief.id) : undefined,
    });
  }

  return {
    create(user: CurrentUser, input: BriefValues): BriefView {
      assertCan(user, 'create:brief:own', 'Only songwriters can write briefs');
      assertVerified(user);
      const now = clock();
      assertDeadlineAhead(input.deadline, user.timeZone, now);
      const id = randomUUID();
      repo.insert({ id, songwriterId: user.id, status: 'draft', ...editableColumns(input), timeZone: user.timeZone, createdAt: now, updatedAt: now });
      return view(repo.findById(id)!, user);
    },

    update(user: CurrentUser, id: string, input: BriefValues): BriefView {
      const brief = loadOwnBrief(repo, user, id);
      assertDraft(brief, 'edited');
      const now = clock();
      assertDeadlineAhead(input.deadline, user.timeZone, now);
      const updated = inTransaction(ctx.db, (tx) => {
        const row = repo.transition(id, ['draft'], 'draft', { ...editableColumns(input), timeZone: user.timeZone }, tx);
        if (!row) throw conflict('brief_not_draft', 'Only a draft can be edited');
        return row;
      });
      return view(updated, user);
    },

    publish(user: CurrentUser, id: string): BriefView {
      const brief = loadOwnBrief(repo, user, id);
      assertVerified(user);
      assertDraft(brief, 'published');
      const now = clock();
      assertDeadlineAhead(brief.deadline, brief.timeZone, now);
      const row = repo.transition(id, ['draft'], 'open', { publishedAt: now });
      if (!row) throw conflict('brief_not_draft', 'Only a draft can be published');
      return view(row, user);
    },

    /** Withdrawing ends the brief for everyone: quotes still waiting are declined and their drummers told. */
    withdraw(user: CurrentUser, id: string): BriefView {
      const brief = loadOwnBrief(repo, user, id);
      if (brief.status !== 'draft' && brief.status !== 'open') {
        throw conflict('brief_not_withdrawable', `A ${brief.status} brief cannot be withdrawn`);
      }
      const row = inTransaction(ctx.db, (tx) => {
        const updated = repo.transition(id, ['draft', 'open'], 'withdrawn', {}, tx);
        if (!updated) throw conflict('brief_not_withdrawable', 'This brief can no longer be withdrawn');
        declineWaitingQuotes(tx, ctx.notifications, updated, { reason: 'The songwriter withdrew the brief', except: null });
        return updated;
      });
      return view(row, user);
    },

    get(user: CurrentUser, id: string): BriefView {
      return view(loadVisibleBrief(repo, user, id), user);
    },

    listMine(user: CurrentUser): { items: BriefListItem[]; total: number } {
      const rows = repo.listByOwner(user.id);
      const counts = repo.quoteCounts(rows.map((r) => r.id));
      const name = user.displayName;
      const items = rows.map((r) => toBriefListItem(r, { songwriterName: name, invited: false, myQuoteId: null, quoteCount: counts.get(r.id) ?? 0 }));
      return { items, total: items.length };
    },

    listOpen(user: CurrentUser, query: OpenBriefsQuery): BriefList {
      assertCan(user, 'read:brief:open', 'Open briefs are for drummers');
      const page = query.page ?? 1;
      const { rows, total } = repo.listOpen(user.id, query, OPEN_BRIEFS_PAGE_SIZE, (page - 1) * OPEN_BRIEFS_PAGE_SIZE);
      const items = rows.map((r) => toBriefListItem(r, { songwriterName: r.songwriterName, invited: !!r.invited, myQuoteId: r.myQuoteId, quoteCount: null }));
      return { items, total, page, pageSize: OPEN_BRIEFS_PAGE_SIZE };
    },

    /** Invites drummers to an open brief: each new invitee gets a notification and a mail, once. */
    invite(user: CurrentUser, id: string, drummerIds: string[]): { invited: string[]; brief: BriefView } {
      const brief = loadOwnBrief(repo, user, id);
      if (brief.status !== 'open') throw conflict('brief_not_open', 'Publish the brief before inviting drummers');
      const wanted = [...new Set(drummerIds)].filter((d) => d !== user.id);
      const found = repo.usersByIds(wanted).filter((u) => u.roles.includes('drummer') && !u.disabledAt);
      if (found.length !== wanted.length) throw invalid('drummerIds', 'Some of those people are not drummers on Kitlane');
      const invited = inTransaction(ctx.db, (tx) => {
        const added = repo.addInvites(id, wanted, clock(), tx);
        for (const drummerId of added) {
          ctx.notifications.notify(
            drummerId,
            {
              kind: 'brief_invite',
              title: `${user.displayName} invited you to quote on “${brief.songTitle}”`,
              body: `${brief.style}, ${brief.tempoBpm} BPM, deadline ${brief.deadline}.`,
              link: `/briefs/${id}`,
              mailParagraphs: [
                `${user.displayName} would like a quote from you for “${brief.songTitle}” (${brief.style}, ${brief.tempoBpm} BPM).`,
                `The deadline is ${brief.deadline}. The brief, its guide track and the quote form are on Kitlane.`,
              ],
            },
            tx,
          );
        }
        return added;
      });
      return { invited, brief: view(repo.findById(id)!, user) };
    },

    /**
     * The owner replaces a draft's guide track; the old files go once the new ones are in place.
     * `receive` runs only after the checks, so nobody can stream a file at a brief they may not change.
     */
    async attachGuide(user: CurrentUser, id: string, receive: () => Promise<ReceivedFile>): Promise<BriefView> {
      const before = loadOwnBrief(repo, user, id);
      assertDraft(before, 'given a new guide track');
      const file = await receive();
      const stored = await storeGuideTrack(ctx.storage, id, file);
      const row = repo.transition(id, ['draft'], 'draft', {
        guideAudioKey: stored.audioKey,
        guidePeaksKey: stored.peaksKey,
        guideMime: stored.mime,
        guideName: stored.name,
        guideDurationSec: stored.durationSec,
      });
      if (!row) {
        await deleteGuideFiles(ctx.storage, [stored.audioKey, stored.peaksKey]);
        throw conflict('brief_not_draft', 'The brief was published meanwhile; the guide track can only change on a draft');
      }
      await deleteGuideFiles(ctx.storage, [before.guideAudioKey, before.guidePeaksKey]);
      return view(row, user);
    },

    /** Storage key and type of the guide, for the people who can see the brief. */
    guideFile(user: CurrentUser, id: string, part: 'audio' | 'peaks'): { key: string; mime: string; fileName: string } {
      const brief = loadVisibleBrief(repo, user, id);
      const key = part === 'audio' ? brief.guideAudioKey : brief.guidePeaksKey;
      if (!key || !brief.guideMime) throw notFound('A guide track');
      return part === 'audio'
        ? { key, mime: brief.guideMime, fileName: brief.guideName ?? 'guide' }
        : { key, mime: 'application/json', fileName: 'peaks.json' };
    },

    canSee(user: CurrentUser, brief: BriefRow): boolean {
      return canSeeBrief(repo, user, brief);
    },

    repo,
  };
}
export type BriefsService = ReturnType<typeof createBriefsService>;
