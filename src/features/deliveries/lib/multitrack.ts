// The review room's audio: one AudioContext, every stem's compressed preview decoded once into an
// AudioBuffer, and on play one AudioBufferSourceNode per stem, all started at the same context time. Web
// Audio schedules those starts on the same sample frame, so the stems stay sample-aligned (the 10 ms
// requirement is met with room to spare) however long they play.

/** The previews' rate (server/features/deliveries/previews): the context runs at it, so nothing resamples. */
export const PREVIEW_RATE = 24_000;
// Scheduling a little ahead lets every source be created before the common start time arrives.
const START_AHEAD_SEC = 0.06;

export type StemChannel = { id: string; buffer: AudioBuffer; gain: GainNode; level: number; muted: boolean; soloed: boolean };

export class Multitrack {
  readonly context: AudioContext;
  private readonly master: GainNode;
  private channels: StemChannel[] = [];
  private sources: AudioBufferSourceNode[] = [];
  private startedAt = 0;
  private offset = 0;
  private playingNow = false;
  private endTimer: ReturnType<typeof setTimeout> | null = null;
  onEnded: (() => void) | null = null;

  constructor() {
    this.context = new AudioContext({ sampleRate: PREVIEW_RATE, latencyHint: 'playback' });
    this.master = this.context.createGain();
    this.master.connect(this.context.destination);
  }

  /** Fetches and decodes every preview in parallel; `onLoaded` reports each stem as it becomes playable. */
  async load(stems: { id: string; url: string }[], onLoaded?: (id: string) => void, signal?: AbortSignal): Promise<void> {
    const loaded = await Promise.all(
      stems.map(async (s) => {
        const res = await fetch(s.url, { credentials: 'same-origin', signal });
        if (!res.ok) throw new Error(`The preview of a stem could not be loaded (${res.status})`);
        const buffer = await this.context.decodeAudioData(await res.arrayBuffer());
        onLoaded?.(s.id);
        return { id: s.id, buffer };
      }),
    );
    this.channels = loaded.map(({ id, buffer }) => {
      const gain = this.context.createGain();
      gain.connect(this.master);
      return { id, buffer, gain, level: 1, muted: false, soloed: false };
    });
    this.applyGains();
  }

  get duration(): number {
    return this.channels.reduce((max, c) => Math.max(max, c.buffer.duration), 0);
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
    this.stopSources();
    this.offset = Math.max(0, Math.min(from, this.duration));
    const when = this.context.currentTime + START_AHEAD_SEC;
    this.sources = this.channels.map((c) => {
      const source = this.context.createBufferSource();
      source.buffer = c.buffer;
      source.connect(c.gain);
      source.start(when, Math.min(this.offset, c.buffer.duration));
      return source;
    });
    this.startedAt = when;
    this.playingNow = true;
    this.endTimer = setTimeout(() => this.finish(), (this.duration - this.offset + START_AHEAD_SEC) * 1000 + 50);
    return when;
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
    await this.context.close();
  }

  private update(id: string, values: Partial<Pick<StemChannel, 'level' | 'muted' | 'soloed'>>): void {
    const c = this.channels.find((x) => x.id === id);
    if (!c) return;
    Object.assign(c, values);
    this.applyGains();
  }

  /** Solo wins over the rest; mute silences a stem even while soloed (the common mixer rule). */
  private applyGains(): void {
    const anySolo = this.channels.some((c) => c.soloed);
    const now = this.context.currentTime;
    for (const c of this.channels) {
      const audible = !c.muted && (!anySolo || c.soloed);
      // A short ramp avoids clicks when a stem is muted mid-play.
      c.gain.gain.setTargetAtTime(audible ? c.level : 0, now, 0.01);
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
