import { BIT_DEPTH_LABELS, STEM_MODE_LABELS, type BriefView } from '@shared/schemas/briefs';
import { budgetText, dateText, lengthText, styleLabel, tempoText } from './format';

function Row({ term, children }: { term: string; children: React.ReactNode }) {
  return (
    <div className="grid gap-1 py-2 sm:grid-cols-[12rem_1fr]">
      <dt className="font-medium text-ink-muted">{term}</dt>
      <dd>{children}</dd>
    </div>
  );
}

/** Everything the songwriter asked for, as a definition list. */
export function BriefSummary({ brief }: { brief: BriefView }) {
  return (
    <div className="space-y-6">
      {brief.description ? (
        <section aria-labelledby="song-heading">
          <h2 id="song-heading" className="text-lg font-bold">
            The song
          </h2>
          <p className="mt-1 whitespace-pre-line">{brief.description}</p>
        </section>
      ) : null}
      {brief.drumNotes ? (
        <section aria-labelledby="drums-heading">
          <h2 id="drums-heading" className="text-lg font-bold">
            What the drums should do
          </h2>
          <p className="mt-1 whitespace-pre-line">{brief.drumNotes}</p>
        </section>
      ) : null}
      <dl className="divide-y divide-line">
        <Row term="Style">{styleLabel(brief.style)}</Row>
        <Row term="Tempo and metre">{tempoText(brief)}</Row>
        {brief.musicalKey ? <Row term="Key">{brief.musicalKey}</Row> : null}
        <Row term="Length">{lengthText(brief)}</Row>
        <Row term="Songs">{brief.songCount}</Row>
        <Row term="Budget">{budgetText(brief)}</Row>
        <Row term="Deadline">
          {dateText(brief.deadline)} <span className="text-ink-muted">({brief.timeZone})</span>
        </Row>
        <Row term="Deliverables">
          {brief.sampleRate / 1000} kHz, {BIT_DEPTH_LABELS[brief.bitDepth]}; {STEM_MODE_LABELS[brief.stemMode].toLowerCase()}
          {brief.stemMode === 'named' && brief.stemList.length ? `: ${brief.stemList.join(', ')}` : ''}
          {brief.roughMix ? '; with a rough mix' : ''}
        </Row>
        <Row term="Room and engineer">{brief.needsRoom ? 'Needed (the drummer brings a room and an engineer)' : 'Not needed'}</Row>
        {brief.referenceNotes ? <Row term="Reference notes">{brief.referenceNotes}</Row> : null}
      </dl>
    </div>
  );
}
