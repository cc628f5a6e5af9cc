import { useEffect, useMemo, useRef, useState, type MouseEvent } from 'react';
import { useQueries } from '@tanstack/react-query';
import { getPart } from '@shared/stems/parts';
import { deliveryPaths, type DeliveryFileView, type DeliveryView } from '@shared/schemas/deliveries';
import { Alert, Button, Card, cx, Spinner } from '@/components/ui';
import { useAfterPaint } from '@/lib/use-after-paint';
import { stemPeaksQueryOptions } from '../api/get-stem-peaks';
import { Multitrack } from '../lib/multitrack';
import { formatTime } from '../lib/format';
import { StemWave } from './stem-wave';
import { NotesPanel, type PendingNote } from './notes-panel';

const ROW_HEIGHT = 56;
const ZOOMS = [4, 8, 16, 32, 64, 128, 256];
const DEFAULT_MIX = { muted: false, soloed: false, level: 1 };

/** The multitrack review room: every stem's preview in sync, mute / solo / level per stem, one transport. */
export function ReviewRoom({ delivery }: { delivery: DeliveryView }) {
  const stems = useMemo(() => delivery.files.filter((f) => f.status === 'uploaded' && f.previewStatus === 'ready'), [delivery.files]);
  const engine = useRef<Multitrack | null>(null);
  const [loaded, setLoaded] = useState(0);
  const [ready, setReady] = useState(false);
  const [failed, setFailed] = useState<string | null>(null);
  const [playing, setPlaying] = useState(false);
  const [duration, setDuration] = useState(0);
  const [zoom, setZoom] = useState(1);
  const [scrollerWidth, setScrollerWidth] = useState(800);
  const [mix, setMix] = useState<Record<string, { muted: boolean; soloed: boolean; level: number }>>({});
  const [pending, setPending] = useState<PendingNote | null>(null);
  const playhead = useRef<HTMLDivElement>(null);
  const clock = useRef<HTMLSpanElement>(null);
  const scroller = useRef<HTMLDivElement>(null);
  // The stems' audio and waveforms are fetched once the room has painted (see useAfterPaint).
  const painted = useAfterPaint();
  const peaks = useQueries({ queries: stems.map((s) => stemPeaksQueryOptions(delivery.id, s.id, s.hasPeaks && painted)) });
  const stemKey = stems.map((s) => s.id).join(',');

  // Loads the previews once per set of stems; the marks let tests and people measure open → playable.
  useEffect(() => {
    if (stems.length === 0 || !painted) return;
    const controller = new AbortController();
    const mt = new Multitrack();
    engine.current = mt;
    performance.mark('review-open');
    let count = 0;
    const known = Math.max(0, ...(delivery.check.report?.stems ?? []).map((s) => s.durationSec));
    mt.load(stems.map((s) => ({ id: s.id, url: deliveryPaths.preview(delivery.id, s.id) })), known, () => setLoaded(++count), controller.signal)
      .then(() => {
        performance.mark('review-playable');
        setDuration(mt.duration);
        setReady(true);
        // The audio output opens now, in a task of its own, before the whole stems' decoding takes the CPU:
        // opened at the first click instead, its start took about a second behind that decoding (bench:review).
        setTimeout(() => mt.warmUp(), 0);
        return mt.whenWhole().then(() => performance.mark('review-whole'));
      })
      .catch((e: unknown) => {
        if ((e as Error).name !== 'AbortError') setFailed(e instanceof Error ? e.message : 'The stems could not be loaded');
      });
    mt.onEnded = () => setPlaying(false);
    return () => {
      controller.abort();
      void mt.close();
      engine.current = null;
      setReady(false);
      setLoaded(0);
    };
    // eslint-disable-next-line react-hooks/exhaustive-deps -- reload only when the set of stems changes
  }, [delivery.id, stemKey, painted]);

  useEffect(() => {
    const el = scroller.current;
    if (!el) return;
    const observer = new ResizeObserver(() => setScrollerWidth(el.clientWidth));
    observer.observe(el);
    return () => observer.disconnect();
  }, []);

  const width = Math.max(scrollerWidth, Math.round(scrollerWidth * zoom));
  const pxPerSec = duration > 0 ? width / duration : 0;

  // The playhead and clock move every frame without re-rendering the rows.
  useEffect(() => {
    let frame = 0;
    const tick = () => {
      const mt = engine.current;
      if (mt && playhead.current && clock.current) {
        playhead.current.style.transform = `translateX(${mt.position * pxPerSec}px)`;
        clock.current.textContent = formatTime(mt.position);
      }
      frame = requestAnimationFrame(tick);
    };
    frame = requestAnimationFrame(tick);
    return () => cancelAnimationFrame(frame);
  }, [pxPerSec]);

  function toggle() {
    const mt = engine.current;
    if (!mt || !ready) return;
    if (mt.playing) {
      mt.pause();
      setPlaying(false);
    } else {
      void mt.play().then(() => performance.mark('review-playing'));
      setPlaying(true);
    }
  }

  function seek(to: number) {
    engine.current?.seek(to);
  }

  function setChannel(id: string, values: Partial<{ muted: boolean; soloed: boolean; level: number }>) {
    const next = { ...DEFAULT_MIX, ...mix[id], ...values };
    setMix({ ...mix, [id]: next });
    const mt = engine.current;
    if (!mt) return;
    if (values.muted !== undefined) mt.setMuted(id, values.muted);
    if (values.soloed !== undefined) mt.setSoloed(id, values.soloed);
    if (values.level !== undefined) mt.setLevel(id, values.level);
  }

  function onTimelineClick(event: MouseEvent<HTMLDivElement>, file: DeliveryFileView | null) {
    if (!pxPerSec) return;
    const rect = event.currentTarget.getBoundingClientRect();
    const at = Math.max(0, Math.min(duration, (event.clientX - rect.left) / pxPerSec));
    seek(at);
    if (delivery.can.note) setPending({ atSec: Math.round(at * 10) / 10, fileId: file?.id ?? null });
  }

  if (stems.length === 0) return <Alert tone="info">The previews are still being made; the review room opens when they are ready.</Alert>;

  return (
    <div className="space-y-4">
      <Card className="space-y-3" aria-label="Review room">
        <div className="flex flex-wrap items-center gap-3">
          <Button onClick={toggle} disabled={!ready} aria-pressed={playing} data-testid="transport-play">
            {playing ? 'Pause' : 'Play'}
          </Button>
          <Button variant="secondary" size="sm" disabled={!ready} onClick={() => seek(0)}>
            Back to start
          </Button>
          <span className="font-mono tabular-nums" aria-label="Position">
            <span ref={clock}>0:00.0</span> / {formatTime(duration)}
          </span>
          <span className="ml-auto flex items-center gap-2">
            <Button variant="secondary" size="sm" onClick={() => setZoom((z) => ZOOMS[Math.max(0, ZOOMS.indexOf(z) - 1)] ?? 1)} disabled={zoom <= 1} aria-label="Zoom out">
              −
            </Button>
            <span className="text-sm text-ink-muted">Zoom ×{zoom}</span>
            <Button variant="secondary" size="sm" onClick={() => setZoom((z) => (z < ZOOMS[0] ? ZOOMS[0] : ZOOMS[Math.min(ZOOMS.length - 1, ZOOMS.indexOf(z) + 1)]))} disabled={zoom >= ZOOMS[ZOOMS.length - 1]} aria-label="Zoom in">
              +
            </Button>
          </span>
        </div>
        {/* The loading line keeps its height once the stems are in, so the lanes below do not jump up. */}
        <div className="min-h-6">
          {!ready && !failed ? <Spinner label={`Loading the stems (${loaded} of ${stems.length})`} /> : null}
        </div>
        {failed ? <Alert tone="error">{failed}</Alert> : null}
        <div className="grid grid-cols-[13rem_1fr] gap-x-3">
          <ul aria-label="Stems" className="space-y-1">
            {stems.map((s) => {
              const m = { ...DEFAULT_MIX, ...mix[s.id] };
              const label = getPart(s.part ?? '')?.label ?? s.name;
              return (
                <li key={s.id} className="flex flex-col justify-center" style={{ height: ROW_HEIGHT }} data-testid="stem-row">
                  <span className="truncate text-sm font-medium" title={s.name}>
                    {label}
                    <span className="sr-only"> ({s.name})</span>
                  </span>
                  <span className="flex items-center gap-1">
                    <button type="button" aria-pressed={m.muted} onClick={() => setChannel(s.id, { muted: !m.muted })} className={cx('rounded px-1.5 text-xs font-bold', m.muted ? 'bg-danger-700 text-white' : 'bg-canvas-sunken')} aria-label={`Mute ${label}`}>
                      M
                    </button>
                    <button type="button" aria-pressed={m.soloed} onClick={() => setChannel(s.id, { soloed: !m.soloed })} className={cx('rounded px-1.5 text-xs font-bold', m.soloed ? 'bg-accent-400 text-ink' : 'bg-canvas-sunken')} aria-label={`Solo ${label}`}>
                      S
                    </button>
                    <input type="range" min={0} max={1.5} step={0.01} value={m.level} onChange={(e) => setChannel(s.id, { level: Number(e.target.value) })} aria-label={`Level of ${label}`} className="w-24" />
                  </span>
                </li>
              );
            })}
          </ul>
          <div ref={scroller} className="relative overflow-x-auto" data-testid="timeline">
            <div className="relative space-y-1" style={{ width }}>
              {stems.map((s, i) => (
                <div key={s.id} className="relative cursor-crosshair rounded bg-canvas-sunken" style={{ height: ROW_HEIGHT }} onClick={(e) => onTimelineClick(e, s)} data-testid="stem-lane">
                  <StemWave peaks={peaks[i]?.data} width={width} height={ROW_HEIGHT} label={getPart(s.part ?? '')?.label ?? s.name} />
                </div>
              ))}
              {delivery.notes.map((n) => (
                <button
                  key={n.id}
                  type="button"
                  className="absolute top-0 h-full w-1 -translate-x-1/2 bg-accent-400/80"
                  style={{ left: n.atSec * pxPerSec }}
                  onClick={() => seek(n.atSec)}
                  aria-label={`Note at ${formatTime(n.atSec)}: ${n.body}`}
                />
              ))}
              <div ref={playhead} className="pointer-events-none absolute top-0 left-0 h-full w-0.5 bg-brand-700" aria-hidden />
            </div>
          </div>
        </div>
        {delivery.can.note ? <p className="text-sm text-ink-muted">Click a stem’s waveform to leave a note at that point.</p> : null}
      </Card>
      <NotesPanel delivery={delivery} stems={stems} pending={pending} onPendingChange={setPending} onJump={seek} />
    </div>
  );
}
