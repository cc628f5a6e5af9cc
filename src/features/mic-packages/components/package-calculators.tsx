import { useId, useState } from 'react';
import { closeMicOverheadOffsets, delayForDistance, KIT_NEIGHBOURS, neighbourKey, SOURCES, threeToOneChecks } from '@shared/mic-package';
import type { MicChannelInput } from '@shared/schemas/mic-packages';
import { Card } from '@/components/ui';
import { fieldClasses } from '@/components/ui/text-field';

const RATES = [44_100, 48_000, 88_200, 96_000];
const fmt = (n: number, digits = 2) => (Math.round(n * 10 ** digits) / 10 ** digits).toString();

/**
 * Calculators beside the input list: a distance difference → delay (ms, samples) → first comb notch;
 * the offsets to expect between each close mic and the overheads; the 3:1 check (common practice).
 * Physics from REFERENCES.md: c = 331.3 + 0.606·T m/s; first notch at 1/(2τ).
 */
export function PackageCalculators({ channels }: { channels: MicChannelInput[] }) {
  const distId = useId();
  const rateId = useId();
  const [distance, setDistance] = useState('34.3');
  const [rate, setRate] = useState(48_000);
  const cm = Number(distance);
  const delay = distance.trim() !== '' && Number.isFinite(cm) ? delayForDistance(cm, { sampleRate: rate }) : null;
  const offsets = closeMicOverheadOffsets(channels, { sampleRate: rate });
  const [spacings, setSpacings] = useState<Record<string, string>>({});
  const present = KIT_NEIGHBOURS.filter((n) => channels.some((c) => c.source === n.a) && channels.some((c) => c.source === n.b));
  const spacingCm = Object.fromEntries(Object.entries(spacings).map(([k, v]) => [k, Number(v)]).filter(([, v]) => Number.isFinite(v) && (v as number) > 0));
  const checks = threeToOneChecks(channels, spacingCm);
  const failing = checks.filter((c) => !c.ok);
  return (
    <div className="space-y-4">
      <Card className="space-y-3">
        <h3 className="text-lg font-bold">Distance → delay → comb notch</h3>
        <div className="grid grid-cols-2 gap-3">
          <div className="space-y-1">
            <label htmlFor={distId} className="block text-sm font-medium">
              Distance difference (cm)
            </label>
            <input id={distId} inputMode="decimal" className={fieldClasses(delay === null)} value={distance} onChange={(e) => setDistance(e.target.value)} />
          </div>
          <div className="space-y-1">
            <label htmlFor={rateId} className="block text-sm font-medium">
              Session rate
            </label>
            <select id={rateId} className={fieldClasses(false)} value={rate} onChange={(e) => setRate(Number(e.target.value))}>
              {RATES.map((r) => (
                <option key={r} value={r}>
                  {r / 1000} kHz
                </option>
              ))}
            </select>
          </div>
        </div>
        {delay ? (
          <p aria-live="polite" data-testid="delay-result">
            {fmt(delay.ms, 3)} ms = {fmt(delay.samples, 1)} samples at {rate / 1000} kHz
            {delay.firstNotchHz !== null ? `; summed with the other mic the first notch is at ${Math.round(delay.firstNotchHz)} Hz` : ''}.
          </p>
        ) : (
          <p>Enter a distance in cm.</p>
        )}
      </Card>

      <Card className="space-y-2">
        <h3 className="text-lg font-bold">Close mics against the overheads</h3>
        {offsets.length === 0 ? (
          <p className="text-ink-muted">Give distances for close mics and overheads to see the expected offsets.</p>
        ) : (
          <table className="w-full text-left text-sm">
            <caption className="sr-only">Expected arrival offset of each overhead after each close mic</caption>
            <thead>
              <tr>
                <th scope="col" className="py-1 pr-2">Close mic</th>
                <th scope="col" className="py-1 pr-2">Overhead</th>
                <th scope="col" className="py-1 pr-2">Later by</th>
                <th scope="col" className="py-1">First notch</th>
              </tr>
            </thead>
            <tbody>
              {offsets.map((o) => (
                <tr key={`${o.closeChannel}-${o.overheadChannel}`} className="border-t border-line">
                  <td className="py-1 pr-2">
                    {o.closeChannel} {SOURCES[o.closeSource].label}
                  </td>
                  <td className="py-1 pr-2">
                    {o.overheadChannel} {SOURCES[o.overheadSource].label}
                  </td>
                  <td className="py-1 pr-2">
                    {fmt(o.ms)} ms ({Math.round(o.samples)} smp)
                  </td>
                  <td className="py-1">{o.firstNotchHz ? `${Math.round(o.firstNotchHz)} Hz` : '—'}</td>
                </tr>
              ))}
            </tbody>
          </table>
        )}
      </Card>

      <Card className="space-y-2">
        <h3 className="text-lg font-bold">3:1 check (common practice)</h3>
        <p className="text-sm text-ink-muted">Neighbouring close mics should be at least three times as far from each other as each is from its own drum.</p>
        {checks.length === 0 ? <p>No neighbouring close mics with distances yet.</p> : null}
        {present.length > 0 ? (
          <details>
            <summary className="cursor-pointer text-sm font-medium text-brand-800">Enter the real spacing between neighbouring drums</summary>
            <div className="mt-2 grid grid-cols-2 gap-2">
              {present.map((n) => {
                const key = neighbourKey(n.a, n.b);
                return (
                  <label key={key} className="space-y-1 text-sm">
                    <span className="block">
                      {SOURCES[n.a].label} ↔ {SOURCES[n.b].label} (cm)
                    </span>
                    <input
                      inputMode="decimal"
                      className={fieldClasses(false)}
                      placeholder={`${n.typicalSpacingCm} (typical)`}
                      value={spacings[key] ?? ''}
                      onChange={(e) => setSpacings((s) => ({ ...s, [key]: e.target.value }))}
                    />
                  </label>
                );
              })}
            </div>
          </details>
        ) : null}
        {failing.length > 0 ? (
          <ul className="space-y-2" aria-label="3:1 warnings">
            {failing.map((c) => (
              <li key={`${c.channelA}-${c.channelB}`} className="rounded-lg border border-accent-400 bg-accent-100 px-3 py-2 text-sm" data-testid="three-to-one-warning">
                <span className="font-bold">3:1 warning:</span> {c.message}
              </li>
            ))}
          </ul>
        ) : checks.length > 0 ? (
          <p className="text-success-700">Every neighbouring pair keeps 3:1.</p>
        ) : null}
        {checks.some((c) => c.ok) && failing.length > 0 ? (
          <p className="text-sm">{checks.filter((c) => c.ok).length} other pairs keep 3:1.</p>
        ) : null}
      </Card>
    </div>
  );
}
