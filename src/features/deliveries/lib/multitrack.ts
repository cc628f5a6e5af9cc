import { prefixBytes } from './mp3-frames';

// The review room's audio: one AudioContext, every stem's compressed preview decoded once into an
// AudioBuffer, and on play one AudioBufferSourceNode per stem, all started at the same context time. Web
// Audio schedules those starts on the same sample frame, so the stems stay sample-aligned (the 10 ms
// requirement is met with room to spare) however long they play.
//
// The previews are decoded on an OfflineAudioContext, which opens no audio device and costs well under a
// millisecond to make. The AudioContext that plays is opened later, in a task of its own (warmUp, once the
// room is playable; or at the first use if that comes sooner): the first one a page opens blocks the
// main thread for about 110–125 ms while the audio output starts (measured in Debian's Chromium), which was
// most of the review room's blocking time while it loaded. AudioBuffers are not tied to the context that
// decoded them, so the same buffers play on the real one.

/** The previews' rate (server/features/deliveries/previews): the context runs at it, so nothing resamples. */
export const PREVIEW_RATE = 24_000;
// Scheduling a little ahead lets every source be created before the common start time arrives.
const START_AHEAD_SEC = 0.06;
// Decoding 12 four-minute previews takes seconds; the first seconds of each decode in a fraction of that,
// so playback starts on those and switches to the whole stems, on one shared sample frame, when they are in.
const FIRST_PART_SEC = 20;

// Enough bytes for FIRST_PART_SEC at the stereo preview bitrate (128 kbit/s; mono is 64), plus a few frames.
const HEAD_BYTES = Math.ceil((FIRST_PART_SEC * 128_000) / 8) + 8 * 1024;

type Fetched = { bytes: Uint8Array; complete: boolean; fromStart: boolean };

/** `from` onwards of a preview, or its head when `from` is 0; `complete` when the file ends in what came. */
async function fetchPreview(url: string, signal: AbortSignal | undefined, from: number): Promise<Fetched> {
  const range = from === 0 ? `bytes=0-${HEAD_BYTES - 1}` : `bytes=${from}-`;
  const res = await fetch(url, { credentials: 'same-origin', signal, headers: { Range: range } });
  if (!res.ok) throw new Error(`The preview of a stem could not be loaded (${res.status})`);
  const bytes = new Uint8Array(await res.arrayBuffer());
  // 200: the server ignored the range and sent everything. 206: "bytes a-b/total" says whether more follows.
  const total = Number(/\/(\d+)$/.exec(res.headers.get('content-range') ?? '')?.[1] ?? NaN);
  const complete = res.status === 200 || !Number.isFinite(total) || from + bytes.length >= total;
  return { bytes, complete, fromStart: res.status === 200 || from === 0 };
}

/** The whole preview: the head already fetched plus the rest. */
async function restOf(url: string, head: Uint8Array, signal: AbortSignal | undefined): Promise<Uint8Array> {
  const rest = await fetchPreview(url, signal, head.length);
  if (rest.fromStart) return rest.bytes;
  const whole = new Uint8Array(head.length + rest.bytes.length);
  whole.set(head, 0);
  whole.set(rest.bytes, head.length);
  return whole;
}

export type StemChannel = { id: string; buffer: AudioBuffer; full: boolean; gain: GainNode | null; level: number; muted: boolean; soloed: boolean };

export class Multitrack {
  private readonly decoder = new OfflineAudioContext({ numberOfChannels: 1, length: 1, sampleRate: PREVIEW_RATE });
  private output: { context: AudioContext; master: GainNode } | null = null;
  private closed = false;
  private channels: StemChannel[] = [];
  private sources: AudioBufferSourceNode[] = [];
  private startedAt = 0;
  private offset = 0;
  private playingNow = false;
  private endTimer: ReturnType<typeof setTimeout> | null = null;
  onEnded: (() => void) | null = null;

  private get context(): AudioContext {
    return this.openOutput();
  }

  /** The playing context, opened on first use; every stem gets its gain node on it then. */
  private openOutput(): AudioContext {
    if (!this.output) {
      const context = new AudioContext({ sampleRate: PREVIEW_RATE, latencyHint: 'playback' });
      const master = context.createGain();
      master.connect(context.destination);
      this.output = { context, master };
      for (const c of this.channels) this.connect(c);
      this.applyGains();
    }
    return this.output.context;
  }

  private connect(channel: StemChannel): void {
    if (!this.output || channel.gain) return;
    channel.gain = this.output.context.createGain();
    channel.gain.connect(this.output.master);
  }

  /** Opens the audio output ahead of the first play, off the load path (idempotent). */
  warmUp(): void {
    if (!this.closed) this.openOutput();
  }

  /**
   * Fetches every preview and decodes the first seconds of each (resolves then: playable); the whole stems
   * decode afterwards and take over without a gap. `durationSec` is the stems' known length (the check's).
   */
  async load(stems: { id: string; url: string }[], durationSec: number, onLoaded?: (id: string) => void, signal?: AbortSignal): Promise<void> {
    this.knownDuration = durationSec;
    // Only the head of each preview is needed to play, so that is fetched (and decoded, stem by stem as it
    // arrives) first; the rest of every file follows once all heads are in. Measured with 12 stems of
    // 4 minutes (bench/review-room.ts), waiting for the whole 22 MB first was most of open → playable.
    const firsts = await Promise.all(
      stems.map(async (s) => {
        const head = await fetchPreview(s.url, signal, 0);
        const cut = prefixBytes(head.bytes, FIRST_PART_SEC);
        // decodeAudioData detaches what it is given: hand it a copy of the first part.
        const buffer = await this.decoder.decodeAudioData(head.bytes.slice(0, cut).buffer);
        onLoaded?.(s.id);
        return { id: s.id, url: s.url, head, buffer, full: head.complete && cut >= head.bytes.length };
      }),
    );
    this.channels = firsts.map(({ id, buffer, full }) => ({ id, buffer, full, gain: null, level: 1, muted: false, soloed: false }));
    for (const c of this.channels) this.connect(c);
    this.applyGains();
    const files = firsts.map((f) => ({ id: f.id, bytes: f.head.complete ? Promise.resolve(f.head.bytes) : restOf(f.url, f.head.bytes, signal) }));
    // decodeWhole awaits them in turn; when one fails (an abort) the others must not surface as unhandled.
    for (const f of files) f.bytes.catch(() => undefined);
    this.wholeStems = this.decodeWhole(files, signal);
  }

  /** Resolves when every stem is decoded whole (playback no longer depends on the first part). */
  whenWhole(): Promise<void> {
    return this.wholeStems;
  }

  private knownDuration = 0;
  private wholeStems: Promise<void> = Promise.resolve();

  private async decodeWhole(files: { id: string; bytes: Promise<Uint8Array> }[], signal?: AbortSignal): Promise<void> {
    // One at a time: the page stays responsive and the first parts keep playing meanwhile.
    const whole: { id: string; buffer: AudioBuffer }[] = [];
    for (const f of files) {
      if (signal?.aborted || this.closed) return;
      const channel = this.channels.find((c) => c.id === f.id);
      if (channel?.full) continue;
      const bytes = await f.bytes;
      whole.push({ id: f.id, buffer: await this.decoder.decodeAudioData(bytes.buffer as ArrayBuffer) });
    }
    if (this.closed) return;
    const swap = this.playingNow ? this.context.currentTime + START_AHEAD_SEC * 2 : null;
    for (const w of whole) {
      const c = this.channels.find((x) => x.id === w.id);
      if (c) Object.assign(c, { buffer: w.buffer, full: true });
    }
    if (swap !== null) this.restartAt(swap);
  }

  get duration(): number {
    return Math.max(this.knownDuration, this.channels.reduce((max, c) => Math.max(max, c.buffer.duration), 0));
  }

  get playing(): boolean {
    return this.playingNow;
  }

  /** The transport position in seconds. */
  get position(): number {
    if (!this.playingNow) return this.offset;
    return Math.min(this.duration, this.offset + Math.max(0, this.context.currentTime - this.startedAt));
  }

  /** Bytes the decoded stems hold (32-bit floats per frame and channel). */
  get decodedBytes(): number {
    return this.channels.reduce((sum, c) => sum + c.buffer.length * c.buffer.numberOfChannels * 4, 0);
  }

  async play(from = this.position): Promise<number> {
    if (this.context.state === 'suspended') await this.context.resume();
    const target = Math.max(0, Math.min(from, this.duration));
    // Beyond the decoded first part: wait for the whole stems rather than play silence.
    if (this.channels.some((c) => !c.full && target > c.buffer.duration - 1)) await this.wholeStems;
    this.offset = target;
    const when = this.context.currentTime + START_AHEAD_SEC;
    this.restartAt(when, target);
    return when;
  }

  /** Stops what plays and starts every stem at context time `when`, at transport position `at`. */
  private restartAt(when: number, at = this.offset + Math.max(0, when - this.startedAt)): void {
    const old = this.sources;
    this.sources = this.channels.map((c) => {
      const source = this.context.createBufferSource();
      source.buffer = c.buffer;
      if (c.gain) source.connect(c.gain);
      if (at < c.buffer.duration) source.start(when, at);
      return source;
    });
    // The old sources end on the very frame the new ones begin: no gap, no overlap.
    for (const s of old) {
      try {
        s.stop(when);
      } catch {
        // Never started (past its end): nothing to stop.
      }
    }
    setTimeout(() => old.forEach((s) => s.disconnect()), (when - this.context.currentTime) * 1000 + 200);
    this.offset = at;
    this.startedAt = when;
    this.playingNow = true;
    if (this.endTimer) clearTimeout(this.endTimer);
    this.endTimer = setTimeout(() => this.finish(), (this.duration - at + (when - this.context.currentTime)) * 1000 + 50);
  }

  pause(): void {
    if (!this.playingNow) return;
    this.offset = this.position;
    this.stopSources();
    this.playingNow = false;
  }

  seek(to: number): void {
    if (this.playingNow) void this.play(to);
    else this.offset = Math.max(0, Math.min(to, this.duration));
  }

  setLevel(id: string, level: number): void {
    this.update(id, { level });
  }
  setMuted(id: string, muted: boolean): void {
    this.update(id, { muted });
  }
  setSoloed(id: string, soloed: boolean): void {
    this.update(id, { soloed });
  }

  /** Start times of the current sources in context seconds (the sync check reads them). */
  scheduledStarts(): number[] {
    return this.sources.map(() => this.startedAt);
  }

  async close(): Promise<void> {
    this.stopSources();
    this.playingNow = false;
    this.closed = true;
    await this.output?.context.close();
  }

  private update(id: string, values: Partial<Pick<StemChannel, 'level' | 'muted' | 'soloed'>>): void {
    const c = this.channels.find((x) => x.id === id);
    if (!c) return;
    Object.assign(c, values);
    this.applyGains();
  }

  /** Solo wins over the rest; mute silences a stem even while soloed (the common mixer rule). */
  private applyGains(): void {
    // Before the output opens there are no gain nodes: the levels wait in the channels and apply on opening.
    if (!this.output) return;
    const anySolo = this.channels.some((c) => c.soloed);
    const now = this.output.context.currentTime;
    for (const c of this.channels) {
      const audible = !c.muted && (!anySolo || c.soloed);
      // A short ramp avoids clicks when a stem is muted mid-play.
      c.gain?.gain.setTargetAtTime(audible ? c.level : 0, now, 0.01);
    }
  }

  private finish(): void {
    if (!this.playingNow || this.position < this.duration - 0.05) return;
    this.stopSources();
    this.playingNow = false;
    this.offset = 0;
    this.onEnded?.();
  }

  private stopSources(): void {
    if (this.endTimer) clearTimeout(this.endTimer);
    this.endTimer = null;
    for (const s of this.sources) {
      try {
        s.stop();
      } catch {
        // A source that never started (closed context) has nothing to stop.
      }
      s.disconnect();
    }
    this.sources = [];
  }
}
