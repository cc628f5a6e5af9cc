import { useId } from 'react';
import type { RoomAcousticsView } from '@shared/schemas/rooms';

const W = 420;
const H = 190;
const M = { top: 24, right: 14, bottom: 42, left: 60 };
const AXES = ['length', 'width', 'height'] as const;
const TICKS_HZ = [20, 30, 50, 100, 200, 300, 500, 1000];
const FLAG = '#b42318'; // danger-700
const MODE = '#0f766e'; // brand-700

/**
 * The axial modes of each dimension on a log-frequency axis, one row per dimension. Modes of different
 * dimensions within 5 % of each other (coincident: they reinforce) are drawn in red with a ring; the
 * Schroeder frequency is the dashed line above which single modes stop dominating.
 */
export function ModesChart({ acoustics }: { acoustics: RoomAcousticsView }) {
  const titleId = useId();
  const descId = useId();
  const { modes, schroederHz } = acoustics;
  const top = Math.max(300, ...modes.map((m) => m.hz), schroederHz) * 1.15;
  const bottom = Math.min(20, ...modes.map((m) => m.hz)) * 0.9;
  const plotW = W - M.left - M.right;
  const rowH = (H - M.top - M.bottom) / AXES.length;
  const x = (hz: number) => M.left + (plotW * Math.log(hz / bottom)) / Math.log(top / bottom);
  const rowY = (axis: (typeof AXES)[number]) => M.top + rowH * (AXES.indexOf(axis) + 0.5);
  const coincident = modes.filter((m) => m.coincidentWith.length > 0);
  return (
    <figure className="space-y-2">
      <svg viewBox={`0 0 ${W} ${H}`} className="h-auto w-full" role="img" aria-labelledby={`${titleId} ${descId}`}>
        <title id={titleId}>Axial room modes by dimension, with the Schroeder frequency</title>
        <desc id={descId}>
          {AXES.map((a) => `${a}: ${modes.filter((m) => m.axis === a).map((m) => `${m.hz.toFixed(1)} Hz`).join(', ')}`).join('. ')}. Schroeder frequency{' '}
          {Math.round(schroederHz)} Hz. {coincident.length > 0 ? `${coincident.length} modes coincide with a mode of another dimension.` : 'No coincident modes.'}
        </desc>
        {TICKS_HZ.filter((t) => t >= bottom && t <= top).map((t) => (
          <g key={t}>
            <line x1={x(t)} x2={x(t)} y1={M.top} y2={H - M.bottom} stroke="#e2d9cc" />
            <text x={x(t)} y={H - M.bottom + 16} textAnchor="middle" fontSize="13" fill="#1f1b16">
              {t >= 1000 ? `${t / 1000}k` : t}
            </text>
          </g>
        ))}
        <text x={M.left + plotW / 2} y={H - 4} textAnchor="middle" fontSize="13" fill="#1f1b16">
          Frequency (Hz, log scale)
        </text>
        {AXES.map((a) => (
          <g key={a}>
            <line x1={M.left} x2={W - M.right} y1={rowY(a)} y2={rowY(a)} stroke="#a8998a" />
            <text x={M.left - 8} y={rowY(a) + 4} textAnchor="end" fontSize="13" fill="#1f1b16">
              {a}
            </text>
          </g>
        ))}
        <line x1={x(schroederHz)} x2={x(schroederHz)} y1={M.top - 8} y2={H - M.bottom} stroke="#1f1b16" strokeDasharray="5 4" />
        <text x={x(schroederHz) + (x(schroederHz) > W * 0.65 ? -4 : 4)} y={M.top - 10} textAnchor={x(schroederHz) > W * 0.65 ? 'end' : 'start'} fontSize="12" fill="#1f1b16">
          Schroeder {Math.round(schroederHz)} Hz
        </text>
        {modes.map((m) => {
          const flagged = m.coincidentWith.length > 0;
          return (
            <g key={`${m.axis}-${m.order}`}>
              <line x1={x(m.hz)} x2={x(m.hz)} y1={rowY(m.axis) - 10} y2={rowY(m.axis) + 10} stroke={flagged ? FLAG : MODE} strokeWidth="3" />
              {flagged ? <circle cx={x(m.hz)} cy={rowY(m.axis)} r="8" fill="none" stroke={FLAG} strokeWidth="2" /> : null}
            </g>
          );
        })}
      </svg>
      <figcaption className="text-sm text-ink-muted">
        Each tick is a mode (n·c / 2L). Red ringed ticks fall within 5 % of a mode of another dimension and reinforce each other.
      </figcaption>
      {coincident.length > 0 ? (
        <ul className="list-disc pl-5 text-sm">
          {coincident
            .filter((m) => m.coincidentWith.every((o) => o.hz >= m.hz))
            .map((m) => (
              <li key={`${m.axis}-${m.order}`}>
                Coincident near {Math.round(m.hz)} Hz: {m.axis} mode {m.order} with {m.coincidentWith.map((o) => `${o.axis} mode ${o.order} (${o.hz.toFixed(1)} Hz)`).join(', ')}
              </li>
            ))}
        </ul>
      ) : (
        <p className="text-sm">No two dimensions share a mode within 5 %.</p>
      )}
    </figure>
  );
}
