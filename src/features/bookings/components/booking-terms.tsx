import { formatMoney } from '@shared/money';
import { BIT_DEPTH_LABELS, formatMinutesSeconds, STEM_MODE_LABELS } from '@shared/schemas/briefs';
import type { BookingView } from '@shared/schemas/bookings';
import { Card } from '@/components/ui';
import { LegalCaution, LineItems, RightsText } from '@/features/quotes/components/quote-terms';
import { dateText } from '@/features/briefs/components/format';

function Row({ term, children }: { term: string; children: React.ReactNode }) {
  return (
    <div className="grid gap-1 py-2 sm:grid-cols-[12rem_1fr]">
      <dt className="font-medium text-ink-muted">{term}</dt>
      <dd>{children}</dd>
    </div>
  );
}

function Share({ who, amount }: { who: string; amount: string }) {
  return (
    <div className="flex justify-between gap-3 py-1.5">
      <dt>{who}</dt>
      <dd className="tabular-nums">{amount}</dd>
    </div>
  );
}

/** The frozen copy of what was agreed when the quote was accepted. */
export function BookingTerms({ booking }: { booking: BookingView }) {
  const t = booking.terms;
  const d = t.deliverables;
  return (
    <div className="grid gap-6 lg:grid-cols-2">
      <Card>
        <h2 className="mb-3 text-xl font-bold">Price</h2>
        <LineItems items={t.lineItems} totalMinor={t.totalMinor} currency={t.currency} extraRevisionMinor={t.extraRevisionMinor} />
        <h3 className="mt-5 font-bold">Shares of the total</h3>
        <dl className="mt-1 divide-y divide-line">
          <Share who={`${booking.drummer.displayName} (drummer)`} amount={formatMoney(booking.drummerShareMinor, booking.currency)} />
          {booking.engineer ? <Share who={`${booking.engineer.displayName} (engineer)`} amount={formatMoney(booking.engineerShareMinor, booking.currency)} /> : null}
        </dl>
        <p className="mt-3 text-sm text-ink-muted">The service fee is added at checkout.</p>
      </Card>
      <Card>
        <h2 className="mb-3 text-xl font-bold">Agreed terms</h2>
        <dl className="divide-y divide-line">
          <Row term="Song">{t.songTitle}</Row>
          <Row term="Tempo and metre">
            {t.tempoBpm} BPM · {t.timeSignature}
          </Row>
          <Row term="Length">{t.lengthBars != null ? `${t.lengthBars} bars` : t.lengthSeconds != null ? formatMinutesSeconds(t.lengthSeconds) : '—'}</Row>
          <Row term="Revisions included">{t.revisionsIncluded}</Row>
          <Row term="Turnaround">{t.turnaroundDays} days</Row>
          {t.recordingDate ? <Row term="Recording date">{dateText(t.recordingDate)}</Row> : null}
          <Row term="Deliverables">
            {d.sampleRate / 1000} kHz, {BIT_DEPTH_LABELS[d.bitDepth]}; {STEM_MODE_LABELS[d.stemMode].toLowerCase()}
            {d.stemMode === 'named' && d.stemList.length ? `: ${d.stemList.join(', ')}` : ''}
            {d.roughMix ? '; with a rough mix' : ''}
          </Row>
          {t.packageName ? <Row term="Mic package">{t.packageName}</Row> : null}
          <Row term="Rights">
            <RightsText terms={t.rightsTerms} points={t.royaltyPoints} />
          </Row>
        </dl>
        <div className="mt-3">
          <LegalCaution />
        </div>
      </Card>
    </div>
  );
}
