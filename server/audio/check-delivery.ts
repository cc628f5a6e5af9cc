import { join } from 'node:path';
import type { CheckItem, CheckLevel, DeliveryCheckReport, PairReport, StemReport } from '@shared/schemas/delivery-check';
import { getPart, isPartId, relatedPairs, suggestPart, type PartId, type RelatedPair } from '@shared/stems/parts';
import { runStemTask, type StemTask, type StemTaskResult } from './check-worker';
import { measurePair, type PairMeasure } from './pairs';
import type { CheckPool } from './pool';
import { WavReader } from './wav-reader';

// The per-delivery check: every stem measured (in the pool when one is given), then the delivery-wide
// items: formats against the brief, one length and one start point, length against the brief's bars,
// related pairs' offsets and polarity, and each stem's own problems.

export interface DeliveryFile {
  path: string;
  /** The name the uploader sees (the uploaded file name). */
  name: string;
  /** Part id from shared/stems/parts.ts; suggested from the name when absent. */
  part?: string;
}

export interface DeliveryExpect {
  sampleRate?: number;
  bitDepth?: number | '32f';
  tempo?: number;
  bars?: number;
  beatsPerBar?: number;
  /** Pairs by file name; expectInverted says the delivery is meant to have them in opposite polarity. */
  pairs?: { a: string; b: string; expectInverted?: boolean }[];
}

export interface CheckDeliveryOptions {
  pool?: CheckPool;
  peaksDir?: string;
  onProgress?: (fraction: number, label: string) => void;
}

// Kitlane's thresholds (our own choices, not from a standard).
export const DC_WARN = 0.001; // −60 dBFS
const RUMBLE_WARN_DB = -20;
// Kick and floor tom have real energy near 30 Hz; warn only when it dominates.
const RUMBLE_WARN_LOW_DRUM_DB = -10;
const TRUE_PEAK_WARN_DBTP = 0;
const DISCOVERY_MIN_CORRELATION = 0.5;
const RELIABLE_CORRELATION = 0.3;
const ANALYSIS_SHARE = 0.85;

interface MeasuredStem {
  report: StemReport;
  activity: Float32Array;
}

function safeFileName(name: string): string {
  return name.replace(/[^a-zA-Z0-9._-]+/g, '_').slice(0, 80);
}

function partOf(file: DeliveryFile): PartId | null {
  if (file.part && isPartId(file.part)) return file.part;
  return suggestPart(file.name);
}

function labelOf(stem: StemReport): string {
  const part = stem.part ? getPart(stem.part) : undefined;
  return part && part.id !== 'other' ? part.label.toLowerCase() : stem.name;
}

function capitalise(text: string): string {
  return text.charAt(0).toUpperCase() + text.slice(1);
}

function plural(n: number, word: string): string {
  return `${n} ${word}${n === 1 ? '' : 's'}`;
}

function kHz(rate: number): string {
  return `${rate % 1000 === 0 ? rate / 1000 : (rate / 1000).toFixed(1)} kHz`;
}

function depthLabel(stem: Pick<StemReport, 'encoding' | 'bitDepth'>): string {
  return stem.encoding === 'float' ? `${stem.bitDepth}-bit float` : `${stem.bitDepth}-bit`;
}

function item(id: string, level: CheckLevel, message: string, files: string[], detail?: string): CheckItem {
  return detail === undefined ? { id, level, message, files } : { id, level, message, detail, files };
}

async function measureAll(files: DeliveryFile[], opts: CheckDeliveryOptions): Promise<StemTaskResult[]> {
  let done = 0;
  const tasks: StemTask[] = files.map((file, i) => ({
    path: file.path,
    name: file.name,
    part: partOf(file),
    peaksOut: opts.peaksDir ? join(opts.peaksDir, `${String(i + 1).padStart(2, '0')}-${safeFileName(file.name)}.peaks.json`) : undefined,
  }));
  const runOne = async (task: StemTask): Promise<StemTaskResult> => {
    const result = opts.pool ? await opts.pool.run(task) : await runStemTask(task);
    done++;
    opts.onProgress?.((done / files.length) * ANALYSIS_SHARE, `Checked ${task.name}`);
    return result;
  };
  if (opts.pool) return Promise.all(tasks.map(runOne));
  const results: StemTaskResult[] = [];
  for (const task of tasks) results.push(await runOne(task));
  return results;
}

// ---- delivery-wide items ----------------------------------------------------------------------------

function formatChecks(stems: StemReport[], expect: DeliveryExpect): CheckItem[] {
  const items: CheckItem[] = [];
  const rates = new Set(stems.map((s) => s.sampleRate));
  if (expect.sampleRate !== undefined) {
    const wrong = stems.filter((s) => s.sampleRate !== expect.sampleRate);
    items.push(
      wrong.length === 0
        ? item('sample-rate', 'pass', `All stems are at the requested ${kHz(expect.sampleRate)}.`, [])
        : item('sample-rate', 'fail', `${plural(wrong.length, 'stem')} not at the requested ${kHz(expect.sampleRate)}.`, wrong.map((s) => s.name), wrong.map((s) => `${s.name}: ${s.sampleRate} Hz`).join('; ')),
    );
  } else if (rates.size > 1) {
    items.push(item('sample-rate', 'fail', 'The stems do not all have the same sample rate.', stems.map((s) => s.name), stems.map((s) => `${s.name}: ${s.sampleRate} Hz`).join('; ')));
  } else if (stems.length > 0) {
    items.push(item('sample-rate', 'pass', `All stems are at ${kHz(stems[0].sampleRate)}.`, []));
  }

  const depthOf = (s: StemReport) => (s.encoding === 'float' ? '32f' : s.bitDepth);
  if (expect.bitDepth !== undefined) {
    const wanted = expect.bitDepth;
    const wantedLabel = wanted === '32f' ? '32-bit float' : `${wanted}-bit`;
    const wrong = stems.filter((s) => (wanted === '32f' ? !(s.encoding === 'float' && s.bitDepth === 32) : !(s.encoding === 'pcm' && s.bitDepth === wanted)));
    items.push(
      wrong.length === 0
        ? item('bit-depth', 'pass', `All stems are ${wantedLabel} as requested.`, [])
        : item('bit-depth', 'fail', `${plural(wrong.length, 'stem')} not ${wantedLabel} as requested.`, wrong.map((s) => s.name), wrong.map((s) => `${s.name}: ${depthLabel(s)}`).join('; ')),
    );
  } else if (new Set(stems.map(depthOf)).size > 1) {
    items.push(item('bit-depth', 'warn', 'The stems do not all have the same bit depth.', stems.map((s) => s.name), stems.map((s) => `${s.name}: ${depthLabel(s)}`).join('; ')));
  } else if (stems.length > 0) {
    items.push(item('bit-depth', 'pass', `All stems are ${depthLabel(stems[0])}.`, []));
  }
  return items;
}

function alignmentChecks(stems: StemReport[]): CheckItem[] {
  if (stems.length === 0) return [];
  const items: CheckItem[] = [];
  const lengths = new Set(stems.map((s) => s.frames));
  if (lengths.size === 1) {
    items.push(item('same-length', 'pass', 'All stems have the same length.', [], `${stems[0].frames} frames (${stems[0].durationSec.toFixed(3)} s)`));
  } else {
    const longest = Math.max(...stems.map((s) => s.frames));
    const short = stems.filter((s) => s.frames !== longest);
    items.push(
      item('same-length', 'warn', 'The stems are not all the same length; exporting them all from one start to one end point avoids surprises.', short.map((s) => s.name),
        stems.map((s) => `${s.name}: ${s.frames} frames`).join('; ')),
    );
  }
  const refs = stems.map((s) => s.timeReference);
  const withRef = stems.filter((s) => s.timeReference !== null);
  if (withRef.length === 0) {
    items.push(item('same-start', 'pass', 'No stem carries a time stamp; they will be lined up from their first sample.', [], 'no bext TimeReference in any file'));
  } else if (withRef.length < stems.length) {
    const missing = stems.filter((s) => s.timeReference === null);
    items.push(item('same-start', 'warn', 'Only some stems carry a time stamp, so we cannot confirm they all start at the same point.', missing.map((s) => s.name),
      `bext TimeReference missing in ${missing.map((s) => s.name).join(', ')}`));
  } else if (new Set(refs).size === 1) {
    items.push(item('same-start', 'pass', 'All stems start at the same point.', [], `bext TimeReference ${refs[0]} samples`));
  } else {
    const first = withRef[0].timeReference ?? 0;
    items.push(item('same-start', 'fail', 'The stems do not all start at the same point: they will play out of sync unless they are re-exported from one start.', withRef.filter((s) => s.timeReference !== first).map((s) => s.name),
      withRef.map((s) => `${s.name}: TimeReference ${s.timeReference} (${(((s.timeReference ?? 0) - first) / s.sampleRate).toFixed(3)} s)`).join('; ')));
  }
  return items;
}

function tempoCheck(stems: StemReport[], expect: DeliveryExpect): CheckItem[] {
  if (!expect.tempo || !expect.bars || stems.length === 0) return [];
  const beatsPerBar = expect.beatsPerBar ?? 4;
  const barSec = (beatsPerBar * 60) / expect.tempo;
  const expected = expect.bars * barSec;
  const actual = Math.max(...stems.map((s) => s.durationSec));
  const offBars = (actual - expected) / barSec;
  const detail = `expected ${expect.bars} bars × ${beatsPerBar} beats at ${expect.tempo} BPM = ${expected.toFixed(2)} s; longest stem ${actual.toFixed(2)} s (${offBars >= 0 ? '+' : ''}${offBars.toFixed(2)} bars)`;
  if (Math.abs(actual - expected) <= barSec) return [item('song-length', 'pass', 'The stems are as long as the song in the brief.', [], detail)];
  return [item('song-length', 'warn', `The stems are ${Math.abs(offBars).toFixed(1)} bars ${offBars > 0 ? 'longer' : 'shorter'} than the song in the brief.`, [], detail)];
}

function stemChecks(stems: StemReport[]): CheckItem[] {
  const items: CheckItem[] = [];
  const clipped = stems.filter((s) => s.clippedRuns > 0);
  items.push(
    clipped.length === 0
      ? item('clipping', 'pass', 'No stem is clipped.', [])
      : item('clipping', 'fail', `${plural(clipped.length, 'stem')} ${clipped.length === 1 ? 'is' : 'are'} clipped (distorted by hitting the top of the scale).`, clipped.map((s) => s.name),
        clipped.map((s) => `${s.name}: ${plural(s.clippedRuns, 'run')} of 3+ full-scale samples, ${s.clippedSamples} samples`).join('; ')),
  );
  const empty = stems.filter((s) => s.digitalSilence);
  const quiet = stems.filter((s) => s.silent && !s.digitalSilence);
  if (empty.length > 0) {
    items.push(item('silence', 'fail', `${plural(empty.length, 'stem')} ${empty.length === 1 ? 'is' : 'are'} completely empty.`, empty.map((s) => s.name), 'every sample is zero'));
  }
  if (quiet.length > 0) {
    items.push(item('near-silence', 'warn', `${plural(quiet.length, 'stem')} ${quiet.length === 1 ? 'is' : 'are'} almost silent.`, quiet.map((s) => s.name),
      quiet.map((s) => `${s.name}: peak ${s.samplePeakDbfs} dBFS`).join('; ')));
  }
  if (empty.length === 0 && quiet.length === 0) items.push(item('silence', 'pass', 'Every stem has sound in it.', []));

  const dc = stems.filter((s) => Math.abs(s.dcOffset) >= DC_WARN);
  items.push(
    dc.length === 0
      ? item('dc-offset', 'pass', 'No stem has a DC offset.', [])
      : item('dc-offset', 'warn', `${plural(dc.length, 'stem')} ${dc.length === 1 ? 'has' : 'have'} a DC offset (a constant shift that wastes headroom and can click at edits).`, dc.map((s) => s.name),
        dc.map((s) => `${s.name}: ${s.dcOffset.toFixed(5)} (${(20 * Math.log10(Math.abs(s.dcOffset))).toFixed(1)} dBFS)`).join('; ')),
  );

  const lowDrum = (s: StemReport) => s.part === 'kick_in' || s.part === 'kick_out' || s.part === 'floor_tom_1' || s.part === 'floor_tom_2';
  const rumbly = stems.filter((s) => s.rumbleDb !== null && s.rumbleDb > (lowDrum(s) ? RUMBLE_WARN_LOW_DRUM_DB : RUMBLE_WARN_DB));
  items.push(
    rumbly.length === 0
      ? item('rumble', 'pass', 'No stem has strong low-frequency rumble.', [])
      : item('rumble', 'warn', `${plural(rumbly.length, 'stem')} ${rumbly.length === 1 ? 'has' : 'have'} strong rumble below 30 Hz (often stands, traffic or air handling).`, rumbly.map((s) => s.name),
        rumbly.map((s) => `${s.name}: energy below 30 Hz at ${s.rumbleDb} dB of the whole`).join('; ')),
  );

  const hot = stems.filter((s) => s.truePeakDbtp !== null && s.truePeakDbtp > TRUE_PEAK_WARN_DBTP);
  items.push(
    hot.length === 0
      ? item('true-peak', 'pass', 'No stem goes over 0 dBTP.', [])
      : item('true-peak', 'warn', `${plural(hot.length, 'stem')} ${hot.length === 1 ? 'goes' : 'go'} over full scale between samples; converting or encoding ${hot.length === 1 ? 'it' : 'them'} may distort.`, hot.map((s) => s.name),
        hot.map((s) => `${s.name}: true peak ${s.truePeakDbtp} dBTP, sample peak ${s.samplePeakDbfs} dBFS`).join('; ')),
  );
  return items;
}

// ---- pairs -------------------------------------------------------------------------------------------

interface PairPlan {
  a: MeasuredStem;
  b: MeasuredStem;
  kind: PairReport['kind'];
  rule: RelatedPair | null;
  expectInverted: boolean | null;
}

function planPairs(measured: MeasuredStem[], expect: DeliveryExpect): PairPlan[] {
  const plans: PairPlan[] = [];
  const seen = new Set<string>();
  const key = (x: MeasuredStem, y: MeasuredStem) => [x.report.name, y.report.name].sort().join('\u0000');
  const add = (plan: PairPlan) => {
    const k = key(plan.a, plan.b);
    if (seen.has(k) || plan.a === plan.b) return;
    seen.add(k);
    plans.push(plan);
  };
  const byName = new Map(measured.map((m) => [m.report.name, m]));
  for (const requested of expect.pairs ?? []) {
    const a = byName.get(requested.a);
    const b = byName.get(requested.b);
    if (a && b) add({ a, b, kind: 'requested', rule: null, expectInverted: requested.expectInverted ?? null });
  }
  // Each part id is taken once (the first stem with it) so duplicates do not multiply pairs.
  const byPart = new Map<PartId, MeasuredStem>();
  for (const m of measured) if (m.report.part && isPartId(m.report.part) && !byPart.has(m.report.part)) byPart.set(m.report.part, m);
  for (const rule of relatedPairs([...byPart.keys()])) {
    const a = byPart.get(rule.a);
    const b = byPart.get(rule.b);
    if (a && b) add({ a, b, kind: rule.kind, rule, expectInverted: rule.judgePolarity ? rule.expectInverted : null });
  }
  const unknown = measured.filter((m) => !m.report.part || m.report.part === 'other');
  for (const u of unknown) for (const other of measured) if (other !== u) add({ a: u, b: other, kind: 'correlated', rule: null, expectInverted: null });
  return plans;
}

function pairItem(plan: PairPlan, m: PairMeasure): CheckItem | null {
  const { a, b } = plan;
  const files = [a.report.name, b.report.name];
  const id = `pair:${a.report.name}|${b.report.name}`;
  const la = labelOf(a.report);
  const lb = labelOf(b.report);
  const when = m.lagSamples === 0 ? `${capitalise(lb)} and ${la} line up to the sample` : `${capitalise(lb)} arrives ${Math.abs(m.lagMs).toFixed(2)} ms ${m.lagSamples > 0 ? 'after' : 'before'} ${la} (about ${Math.abs(m.distanceCm).toFixed(0)} cm ${m.lagSamples > 0 ? 'farther' : 'closer'})`;
  const detail = `lag ${m.lagSamples} samples (${m.lagMs} ms, ${m.distanceCm} cm at 343 m/s), correlation ${m.correlation} (500 Hz–5 kHz, ${plural(m.windows, 'window')})`;
  const reliable = Math.abs(m.correlation) >= RELIABLE_CORRELATION;
  if (!reliable) {
    if (plan.kind === 'correlated') return null;
    const level: CheckLevel = plan.kind === 'same_drum' || plan.kind === 'requested' ? 'warn' : 'pass';
    return item(id, level, `${capitalise(la)} and ${lb} have too little sound in common to compare their timing reliably.`, files, detail);
  }
  if (m.atEdge) return item(id, 'warn', `${capitalise(la)} and ${lb} are offset by 10 ms or more; check that they were exported from the same start.`, files, detail);
  const inverted = m.polarity === 'inverted';
  if (plan.expectInverted === null) {
    if (plan.kind === 'correlated' && inverted) {
      return item(id, 'warn', `${when}, in opposite polarity: they pick up the same sound with opposite signs; check whether one should be flipped.`, files, detail);
    }
    return item(id, 'pass', `${when}.`, files, detail);
  }
  const flip = plan.rule ? labelOf((plan.rule.flip === a.report.part ? a : b).report) : lb;
  if (inverted === plan.expectInverted) {
    if (inverted && plan.kind === 'same_drum') {
      // The usual raw state of a top/bottom pair: not an error, but the mix needs the flip.
      return item(id, 'warn', `${when}. ${capitalise(lb)} is inverted against ${la}, as usual for a mic facing the other side of the drum: flip ${flip}'s polarity when mixing (common practice).`, files, detail);
    }
    return item(id, 'pass', `${when}${inverted ? ', in opposite polarity as expected' : ', same polarity'}.`, files, detail);
  }
  if (plan.kind === 'close_overhead' && plan.rule?.expectInverted) {
    // A bottom mic already flipped reads "same" against the overheads: that is fine too.
    return item(id, 'pass', `${when}, same polarity (already flipped).`, files, detail);
  }
  return inverted
    ? item(id, 'warn', `${when}, but in opposite polarity: flip ${flip}'s polarity so they do not cancel.`, files, detail)
    : item(id, 'pass', `${when}; ${lb} is already flipped to match ${la}.`, files, detail);
}

async function measurePairs(measured: MeasuredStem[], expect: DeliveryExpect, opts: CheckDeliveryOptions): Promise<{ pairs: PairReport[]; items: CheckItem[] }> {
  const plans = planPairs(measured, expect).filter((p) => p.a.report.sampleRate === p.b.report.sampleRate);
  const readers = new Map<string, WavReader>();
  const readerFor = async (stem: MeasuredStem) => {
    let reader = readers.get(stem.report.file);
    if (!reader) {
      reader = await WavReader.open(stem.report.file, { blockFrames: 1 });
      readers.set(stem.report.file, reader);
    }
    return reader;
  };
  const pairs: PairReport[] = [];
  const items: CheckItem[] = [];
  try {
    for (let i = 0; i < plans.length; i++) {
      const plan = plans[i];
      opts.onProgress?.(ANALYSIS_SHARE + ((1 - ANALYSIS_SHARE) * i) / plans.length, `Comparing ${plan.a.report.name} and ${plan.b.report.name}`);
      const m = await measurePair({ reader: await readerFor(plan.a), activity: plan.a.activity }, { reader: await readerFor(plan.b), activity: plan.b.activity });
      if (!m) {
        if (plan.kind !== 'correlated') {
          items.push(item(`pair:${plan.a.report.name}|${plan.b.report.name}`, 'pass', `${capitalise(labelOf(plan.a.report))} and ${labelOf(plan.b.report)} never play at the same time, so their timing was not compared.`, [plan.a.report.name, plan.b.report.name]));
        }
        continue;
      }
      if (plan.kind === 'correlated' && Math.abs(m.correlation) < DISCOVERY_MIN_CORRELATION) continue;
      pairs.push({ a: plan.a.report.name, b: plan.b.report.name, kind: plan.kind, lagSamples: m.lagSamples, lagMs: m.lagMs, distanceCm: m.distanceCm, correlation: m.correlation, polarity: m.polarity });
      const pairCheck = pairItem(plan, m);
      if (pairCheck) items.push(pairCheck);
    }
  } finally {
    await Promise.all([...readers.values()].map((r) => r.close()));
  }
  return { pairs, items };
}

// ---- report --------------------------------------------------------------------------------------------

const LEVEL_ORDER: Record<CheckLevel, number> = { pass: 0, warn: 1, fail: 2 };

function worstLevel(items: CheckItem[]): CheckLevel {
  return items.reduce<CheckLevel>((worst, i) => (LEVEL_ORDER[i.level] > LEVEL_ORDER[worst] ? i.level : worst), 'pass');
}

function summarise(stems: StemReport[], unreadable: number, checks: CheckItem[], pairs: PairReport[]): string {
  const parts: string[] = [];
  const total = stems.length + unreadable;
  const rates = new Set(stems.map((s) => s.sampleRate));
  const depths = new Set(stems.map(depthLabel));
  let head = plural(total, 'stem');
  if (stems.length > 0 && rates.size === 1 && depths.size === 1) head += `, ${kHz(stems[0].sampleRate)} / ${depthLabel(stems[0])}`;
  parts.push(head);
  if (unreadable > 0) parts.push(`${unreadable} unreadable`);
  const aligned = checks.find((c) => c.id === 'same-start')?.level === 'pass' && checks.find((c) => c.id === 'same-length')?.level === 'pass';
  if (stems.length > 1) parts.push(aligned ? 'all aligned' : 'not all aligned');
  const byName = new Map(stems.map((s) => [s.name, s]));
  for (const p of pairs) {
    const check = checks.find((c) => c.id === `pair:${p.a}|${p.b}`);
    if (p.polarity === 'inverted' && check?.level === 'warn') {
      const a = byName.get(p.a);
      const b = byName.get(p.b);
      if (a && b) parts.push(`${labelOf(b)} inverted against ${labelOf(a)}`);
    }
  }
  const fails = checks.filter((c) => c.level === 'fail').length;
  if (fails > 0) parts.push(`${plural(fails, 'problem')} to fix`);
  return parts.join(', ').replace(/, ([^,]*inverted against)/, '; $1');
}

export async function checkDelivery(files: DeliveryFile[], expect: DeliveryExpect = {}, opts: CheckDeliveryOptions = {}): Promise<DeliveryCheckReport> {
  opts.onProgress?.(0, 'Reading stems');
  const results = await measureAll(files, opts);
  const measured: MeasuredStem[] = [];
  const unreadable: DeliveryCheckReport['unreadable'] = [];
  const checks: CheckItem[] = [];
  results.forEach((result, i) => {
    const file = files[i];
    if (result.ok) measured.push({ report: result.report, activity: result.activity });
    else {
      unreadable.push({ file: file.path, name: file.name, reason: result.reason });
      checks.push(item(`readable:${file.name}`, 'fail', `${file.name} cannot be read: ${result.reason}.`, [file.name], `${result.code}: ${result.reason}`));
    }
  });
  if (files.length > 0 && unreadable.length === 0) checks.push(item('readable', 'pass', 'Every file is a readable WAV.', []));
  const stems = measured.map((m) => m.report);
  checks.push(...formatChecks(stems, expect), ...alignmentChecks(stems), ...tempoCheck(stems, expect));
  const { pairs, items } = await measurePairs(measured, expect, opts);
  checks.push(...items, ...(stems.length > 0 ? stemChecks(stems) : []));
  opts.onProgress?.(1, 'Done');
  return { stems, pairs, checks, unreadable, summary: summarise(stems, unreadable.length, checks, pairs), level: worstLevel(checks) };
}
