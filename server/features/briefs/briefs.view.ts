import type { BriefListItem, BriefView } from '@shared/schemas/briefs';
import type { BriefRow } from './briefs.repository';

const iso = (d: Date | null) => (d ? d.toISOString() : null);

export function guideOf(row: BriefRow): BriefView['guide'] {
  if (!row.guideAudioKey || !row.guideMime) return null;
  return { name: row.guideName ?? 'guide', mime: row.guideMime, durationSec: row.guideDurationSec, hasPeaks: !!row.guidePeaksKey };
}

/** The API shape of a brief; storage keys never leave the server. */
export function toBriefView(row: BriefRow, extra: { songwriterName: string; viewer: BriefView['viewer']; invitedDrummers?: BriefView['invitedDrummers'] }): BriefView {
  return {
    id: row.id,
    songwriterId: row.songwriterId,
    songwriterName: extra.songwriterName,
    status: row.status,
    songTitle: row.songTitle,
    description: row.description,
    drumNotes: row.drumNotes,
    style: row.style,
    tempoBpm: row.tempoBpm,
    timeSignature: row.timeSignature,
    musicalKey: row.musicalKey,
    lengthBars: row.lengthBars,
    lengthSeconds: row.lengthSeconds,
    songCount: row.songCount,
    referenceNotes: row.referenceNotes,
    sampleRate: row.sampleRate,
    bitDepth: row.bitDepth,
    stemMode: row.stemMode,
    stemList: row.stemList,
    roughMix: row.roughMix,
    budgetMinMinor: row.budgetMinMinor,
    budgetMaxMinor: row.budgetMaxMinor,
    currency: row.currency,
    deadline: row.deadline,
    timeZone: row.timeZone,
    needsRoom: row.needsRoom,
    guide: guideOf(row),
    publishedAt: iso(row.publishedAt),
    createdAt: row.createdAt.toISOString(),
    updatedAt: row.updatedAt.toISOString(),
    viewer: extra.viewer,
    ...(extra.invitedDrummers ? { invitedDrummers: extra.invitedDrummers } : {}),
  };
}

export function toBriefListItem(
  row: BriefRow,
  extra: { songwriterName: string; invited: boolean; myQuoteId: string | null; quoteCount: number | null },
): BriefListItem {
  return {
    id: row.id,
    status: row.status,
    songTitle: row.songTitle,
    style: row.style,
    tempoBpm: row.tempoBpm,
    timeSignature: row.timeSignature,
    budgetMinMinor: row.budgetMinMinor,
    budgetMaxMinor: row.budgetMaxMinor,
    currency: row.currency,
    deadline: row.deadline,
    songCount: row.songCount,
    needsRoom: row.needsRoom,
    publishedAt: iso(row.publishedAt),
    songwriterName: extra.songwriterName,
    invited: extra.invited,
    myQuoteId: extra.myQuoteId,
    quoteCount: extra.quoteCount,
    hasGuide: !!row.guideAudioKey,
  };
}
