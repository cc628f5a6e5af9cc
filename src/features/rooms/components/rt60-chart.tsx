import { useId } from 'react';
import type { RoomAcousticsView } from '@shared/schemas/rooms';

// A viewBox near the card's real width keeps the text readable on phones and on desktop alike.
const W = 420;
const H = 260;
const M = { top: 16, right: 12, bottom: 42, left: 50 };
const SABINE = '#0f766e'; // brand-700
const EYRING = '#92520b'; // accent-700

function bandLabel(hz: number): string {
  return hz >= 1000 ? `${hz / 1000}k` : String(hz);
}

/** A tidy upper bound for the seconds axis and its tick step. */
function secondsAxis(max: number): { top: number; step: number } {
  const steps = [0.1, 0.2, 0.25, 0.5, 1, 2, 5];
  const step = steps.find((s) => max / s <= 6) ?? 10;
  return { top: Math.max(step, Math.ceil((max * 1.05) / step) * step), step };
}

/**
 * Reverberation time per octave band by both formulas, on one chart. Octave bands are equally spaced on a
 * log-frequency axis, so evenly spaced categories are the honest x axis. The drum-reading thresholds are
 * drawn as faint lines so the reading below the chart can be seen on it.
 */
export function Rt60Chart({ acoustics }: { acoustics: RoomAcousticsView }) {
  const titleId = useId();
  const descId = useId();
  const { bands, recommended, readingThresholds } = acoustics;
  const max = Math.max(...bands.flatMap((b) => [b.sabineSec, b.eyringSec]));
  const axis = secondsAxis(max);
  const plotW = W - M.left - M.right;
  const plotH = H - M.top - M.bottom;
  const x = (i: number) => M.left + (plotW * (i + 0.5)) / bands.length;
  const y = (sec: number) => M.top + plotH * (1 - sec / axis.top);
  const ticks = Array.from({ length: Math.round(axis.top / axis.step) + 1 }, (_, i) => i * axis.step);
  const line = (key: 'sabineSec' | 'eyringSec') => bands.map((b, i) => `${i === 0 ? 'M' : 'L'}${x(i).toFixed(1)},${y(b[key]).toFixed(1)}`).join(' ');
  const thresholds = readingThresholds.filter((t): t is { reading: typeof t.reading; belowSec: number } => t.belowSec !== null && t.belowSec <= axis.top);
  return (
    <figure className="space-y-2">
      <svg viewBox={`0 0 ${W} ${H}`} className="h-auto w-full" role="img" aria-labelledby={`${titleId} ${descId}`}>
        <title id={titleId}>Reverberation time (RT60) per octave band, Sabine and Eyring</title>
        <desc id={descId}>
          {bands.map((b) => `${bandLabel(b.hz)} Hz: Sabine ${b.sabineSec.toFixed(2)} s, Eyring ${b.eyringSec.toFixed(2)} s`).join('; ')}
        </desc>
        {ticks.map((t) => (
          <g key={t}>
            <line x1={M.left} x2={W - M.right} y1={y(t)} y2={y(t)} stroke="#e2d9cc" />
            <text x={M.left - 8} y={y(t) + 4} textAnchor="end" fontSize="13" fill="#57504a">
              {t.toFixed(axis.step < 1 ? 2 : 0).replace(/\.?0+$/, '') || '0'}
            </text>
          </g>
        ))}
        {thresholds.map((t) => (
          <g key={t.reading}>
            <line x1={M.left} x2={W - M.right} y1={y(t.belowSec)} y2={y(t.belowSec)} stroke="#a8998a" strokeDasharray="2 4" />
            <text x={M.left + 4} y={y(t.belowSec) - 4} fontSize="11" fill="#57504a">
              {t.belowSec} s
            </text>
          </g>
        ))}
        <text x={14} y={M.top + plotH / 2} transform={`rotate(-90 14 ${M.top + plotH / 2})`} textAnchor="middle" fontSize="13" fill="#1f1b16">
          RT60 (seconds)
        </text>
        {bands.map((b, i) => (
          <text key={b.hz} x={x(i)} y={H - M.bottom + 18} textAnchor="middle" fontSize="13" fill="#1f1b16">
            {bandLabel(b.hz)}
          </text>
        ))}
        <text x={M.left + plotW / 2} y={H - 4} textAnchor="middle" fontSize="13" fill="#1f1b16">
          Octave band (Hz)
        </text>
        <path d={line('sabineSec')} fill="none" stroke={SABINE} strokeWidth={recommended === 'sabine' ? 3 : 2} />
        <path d={line('eyringSec')} fill="none" stroke={EYRING} strokeWidth={recommended === 'eyring' ? 3 : 2} strokeDasharray="6 4" />
        {bands.map((b, i) => (
          <g key={b.hz}>
            <circle cx={x(i)} cy={y(b.sabineSec)} r="4" fill={SABINE} />
            <rect x={x(i) - 4} y={y(b.eyringSec) - 4} width="8" height="8" fill={EYRING} />
          </g>
        ))}
      </svg>
      <figcaption className="flex flex-wrap gap-4 text-sm">
        <span className="inline-flex items-center gap-2">
          <svg width="28" height="10" aria-hidden="true">
            <line x1="0" x2="28" y1="5" y2="5" stroke={SABINE} strokeWidth="3" />
            <circle cx="14" cy="5" r="4" fill={SABINE} />
          </svg>
          Sabine{recommended === 'sabine' ? ' (the one to trust here)' : ''}
        </span>
        <span className="inline-flex items-center gap-2">
          <svg width="28" height="10" aria-hidden="true">
            <line x1="0" x2="28" y1="5" y2="5" stroke={EYRING} strokeWidth="3" strokeDasharray="6 4" />
            <rect x="10" y="1" width="8" height="8" fill={EYRING} />
          </svg>
          Eyring{recommended === 'eyring' ? ' (the one to trust here)' : ''}
        </span>
        <span className="text-ink-muted">Dotted lines: the reading thresholds (common practice)</span>
      </figcaption>
      <details className="text-sm">
        <summary className="cursor-pointer font-medium text-brand-800">Show the numbers</summary>
        <table className="mt-2 w-full text-left">
          <caption className="sr-only">RT60 per octave band</caption>
          <thead>
            <tr>
              <th scope="col" className="py-1 pr-3">Band</th>
              <th scope="col" className="py-1 pr-3">Sabine</th>
              <th scope="col" className="py-1 pr-3">Eyring</th>
              <th scope="col" className="py-1">Average absorption</th>
            </tr>
          </thead>
          <tbody>
            {bands.map((b) => (
              <tr key={b.hz} className="border-t border-line">
                <th scope="row" className="py-1 pr-3 font-normal">{bandLabel(b.hz)} Hz</th>
                <td className="py-1 pr-3">{b.sabineSec.toFixed(2)} s</td>
                <td className="py-1 pr-3">{b.eyringSec.toFixed(2)} s</td>
                <td className="py-1">{b.averageAbsorption.toFixed(2)}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </details>
    </figure>
  );
}
