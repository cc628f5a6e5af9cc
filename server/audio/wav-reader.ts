import { open, type FileHandle } from 'node:fs/promises';
import { endianness } from 'node:os';
import { WavError } from './wav-errors';
import { decodeFrames, type SampleEncoding } from './wav-decode';

// A streaming WAV reader of our own (see docs/decisions/002-streaming-wav-reader.md): headers are read
// chunk by chunk with positioned reads, audio in large blocks into reused buffers, so memory does not
// grow with the file and no size read from the file is ever trusted before it is checked against the
// real file size.

export type WavContainer = 'RIFF' | 'RF64' | 'BW64';

export interface BextInfo {
  description: string;
  originator: string;
  originatorReference: string;
  originationDate: string;
  originationTime: string;
  /** Samples since midnight at the file's own rate (EBU Tech 3285, bytes 338/342 of the body). */
  timeReference: number;
  version: number;
}

export interface WavChunk {
  id: string;
  offset: number;
  size: number;
}

export interface WavInfo {
  container: WavContainer;
  formatTag: number;
  extensible: boolean;
  encoding: SampleEncoding;
  channels: number;
  sampleRate: number;
  /** Bits per sample in the container (the stored width). */
  bitsPerSample: number;
  /** Meaningful bits (EXTENSIBLE's wValidBitsPerSample, else the container width). */
  validBits: number;
  blockAlign: number;
  channelMask: number | null;
  dataOffset: number;
  dataBytes: number;
  frames: number;
  factSampleLength: number | null;
  bext: BextInfo | null;
  chunks: WavChunk[];
  fileSize: number;
}

const MAX_CHUNKS = 4096;
const MAX_SANE_RATE = 10_000_000;
const MIN_RATE = 1000;
const MAX_CHANNELS = 1024;
const U32_UNSET = 0xffffffff;
// The standard KSDATAFORMAT GUID tail shared by PCM and IEEE float sub-formats (bytes 2..15).
const KS_GUID_TAIL = Buffer.from([0x00, 0x00, 0x00, 0x00, 0x10, 0x00, 0x80, 0x00, 0x00, 0xaa, 0x00, 0x38, 0x9b, 0x71]);
const DEFAULT_BLOCK_BYTES = 256 * 1024;

if (endianness() !== 'LE') {
  // The decoders view file bytes through typed arrays, which use the platform's byte order.
  throw new Error('the WAV reader needs a little-endian platform');
}

async function readAt(handle: FileHandle, position: number, length: number): Promise<Buffer> {
  const buffer = Buffer.alloc(length);
  const { bytesRead } = await handle.read(buffer, 0, length, position);
  return bytesRead === length ? buffer : buffer.subarray(0, bytesRead);
}

function fourCc(buffer: Buffer, offset: number): string {
  return buffer.toString('latin1', offset, offset + 4);
}

function isPlausibleChunkId(buffer: Buffer, offset: number): boolean {
  if (buffer.length < offset + 4) return false;
  for (let i = offset; i < offset + 4; i++) {
    const c = buffer[i];
    if (c < 0x20 || c > 0x7e) return false;
  }
  return true;
}

function readU64(buffer: Buffer, offset: number, what: string): number {
  const value = buffer.readBigUInt64LE(offset);
  if (value > BigInt(Number.MAX_SAFE_INTEGER)) throw new WavError('malformed', `malformed: ${what} is too large (${value})`);
  return Number(value);
}

function printable(id: string): string {
  return JSON.stringify(id).slice(1, -1);
}

function cString(buffer: Buffer, start: number, length: number): string {
  const slice = buffer.subarray(start, Math.min(buffer.length, start + length));
  const nul = slice.indexOf(0);
  return slice.toString('latin1', 0, nul === -1 ? slice.length : nul).trim();
}

interface FmtInfo {
  formatTag: number;
  extensible: boolean;
  encoding: SampleEncoding;
  channels: number;
  sampleRate: number;
  bitsPerSample: number;
  validBits: number;
  blockAlign: number;
  channelMask: number | null;
}

function hexTag(tag: number): string {
  return `0x${tag.toString(16).padStart(4, '0').toUpperCase()}`;
}

export function parseFmt(body: Buffer): FmtInfo {
  if (body.length < 16) throw new WavError('malformed', `malformed: fmt chunk is ${body.length} bytes, needs at least 16`);
  const formatTag = body.readUInt16LE(0);
  const channels = body.readUInt16LE(2);
  const sampleRate = body.readUInt32LE(4);
  const blockAlign = body.readUInt16LE(12);
  const bitsPerSample = body.readUInt16LE(14);
  let encodingTag = formatTag;
  let validBits = bitsPerSample;
  let channelMask: number | null = null;
  const extensible = formatTag === 0xfffe;
  if (extensible) {
    if (body.length < 40) throw new WavError('malformed', `malformed: extensible fmt chunk is ${body.length} bytes, needs 40`);
    validBits = body.readUInt16LE(18) || bitsPerSample;
    channelMask = body.readUInt32LE(20);
    encodingTag = body.readUInt16LE(24);
    if (!body.subarray(26, 40).equals(KS_GUID_TAIL)) {
      throw new WavError('unsupported', `unsupported encoding (sub-format GUID ${body.subarray(24, 40).toString('hex')})`);
    }
  }
  if (encodingTag !== 1 && encodingTag !== 3) throw new WavError('unsupported', `unsupported encoding (format tag ${hexTag(encodingTag)})`);
  const encoding: SampleEncoding = encodingTag === 1 ? 'pcm' : 'float';
  if (channels === 0) throw new WavError('malformed', 'malformed: fmt says 0 channels');
  if (channels > MAX_CHANNELS) throw new WavError('unsupported', `unsupported: ${channels} channels`);
  if (sampleRate === 0 || sampleRate > MAX_SANE_RATE) throw new WavError('malformed', `malformed: sample rate ${sampleRate} Hz`);
  // Below this no audio format exists, and per-100 ms bookkeeping would grow with the file.
  if (sampleRate < MIN_RATE) throw new WavError('unsupported', `unsupported: sample rate ${sampleRate} Hz`);
  const widths = encoding === 'pcm' ? [8, 16, 24, 32] : [32, 64];
  if (!widths.includes(bitsPerSample)) {
    throw new WavError('unsupported', `unsupported encoding (${encoding === 'pcm' ? 'PCM' : 'float'} ${bitsPerSample}-bit)`);
  }
  if (validBits > bitsPerSample) throw new WavError('malformed', `malformed: ${validBits} valid bits in a ${bitsPerSample}-bit container`);
  const expectedAlign = channels * (bitsPerSample / 8);
  if (blockAlign !== expectedAlign) {
    throw new WavError('malformed', `malformed: block align ${blockAlign} does not match ${channels} × ${bitsPerSample}-bit`);
  }
  return { formatTag, extensible, encoding, channels, sampleRate, bitsPerSample, validBits, blockAlign, channelMask };
}

export function parseBext(body: Buffer): BextInfo | null {
  // TimeReference sits at 338 (low word) and 342 (high word); anything shorter carries no time.
  if (body.length < 346) return null;
  const low = body.readUInt32LE(338);
  const high = body.readUInt32LE(342);
  return {
    description: cString(body, 0, 256),
    originator: cString(body, 256, 32),
    originatorReference: cString(body, 288, 32),
    originationDate: cString(body, 320, 10),
    originationTime: cString(body, 330, 8),
    timeReference: high * 0x1_0000_0000 + low,
    version: body.length >= 348 ? body.readUInt16LE(346) : 0,
  };
}

interface Ds64 {
  riffSize: number;
  dataSize: number;
  sampleCount: number;
  table: Map<string, number>;
}

function parseDs64(body: Buffer): Ds64 {
  if (body.length < 28) throw new WavError('malformed', `malformed: ds64 chunk is ${body.length} bytes, needs 28`);
  const table = new Map<string, number>();
  const entries = body.readUInt32LE(24);
  for (let i = 0; i < entries && 28 + i * 12 + 12 <= body.length; i++) {
    const at = 28 + i * 12;
    table.set(fourCc(body, at), readU64(body, at + 4, 'a ds64 table size'));
  }
  return {
    riffSize: readU64(body, 0, 'the ds64 RIFF size'),
    dataSize: readU64(body, 8, 'the ds64 data size'),
    sampleCount: readU64(body, 16, 'the ds64 sample count'),
    table,
  };
}

async function readContainer(handle: FileHandle, fileSize: number): Promise<WavContainer> {
  if (fileSize < 12) throw new WavError('not-wav', `not a WAV file (only ${fileSize} bytes)`);
  const head = await readAt(handle, 0, 12);
  const magic = fourCc(head, 0);
  if (magic !== 'RIFF' && magic !== 'RF64' && magic !== 'BW64') {
    throw new WavError('not-wav', `not a WAV file (starts with "${printable(magic)}")`);
  }
  const form = fourCc(head, 8);
  if (form !== 'WAVE') throw new WavError('not-wav', `not a WAV file (${magic} form "${printable(form)}")`);
  return magic;
}

// Reads the body of a small metadata chunk, capped so a lying size cannot make us allocate much.
async function readSmallBody(handle: FileHandle, offset: number, size: number, cap: number): Promise<Buffer> {
  return readAt(handle, offset, Math.min(size, cap));
}

// Some writers forget the pad byte after an odd-sized chunk; accept either when only one of the
// two candidate positions holds something that looks like a chunk id.
async function nextChunkOffset(handle: FileHandle, body: number, size: number, fileSize: number): Promise<number> {
  const end = body + size;
  if ((size & 1) === 0) return end;
  if (end + 1 >= fileSize) return end + 1;
  const probe = await readAt(handle, end, 5);
  if (!isPlausibleChunkId(probe, 1) && isPlausibleChunkId(probe, 0)) return end;
  return end + 1;
}

export async function readWavInfo(handle: FileHandle, fileSize: number): Promise<WavInfo> {
  const container = await readContainer(handle, fileSize);
  const chunks: WavChunk[] = [];
  let fmt: FmtInfo | null = null;
  let ds64: Ds64 | null = null;
  let data: { offset: number; size: number } | null = null;
  let factSampleLength: number | null = null;
  let bext: BextInfo | null = null;
  let position = 12;

  while (position + 8 <= fileSize) {
    if (chunks.length >= MAX_CHUNKS) throw new WavError('malformed', `malformed: more than ${MAX_CHUNKS} chunks`);
    const header = await readAt(handle, position, 8);
    const id = fourCc(header, 0);
    const size32 = header.readUInt32LE(4);
    const body = position + 8;
    const available = fileSize - body;
    let size = size32;
    if (container !== 'RIFF' && size32 === U32_UNSET) {
      const fromDs64 = id === 'data' ? ds64?.dataSize : ds64?.table.get(id);
      if (fromDs64 === undefined) throw new WavError('malformed', `malformed: ${container} chunk "${printable(id)}" has no ds64 size`);
      size = fromDs64;
    }
    chunks.push({ id, offset: position, size });

    if (id === 'data') {
      if (!fmt) throw new WavError('malformed', 'malformed: data chunk comes before the fmt chunk');
      if (size > available) throw new WavError('truncated', `truncated: data chunk claims ${size} bytes, file has ${available}`);
      data = { offset: body, size };
    } else if (size > available) {
      // A broken chunk after the audio costs nothing; before it, the file cannot be trusted.
      if (fmt && data) break;
      throw new WavError('truncated', `truncated: chunk "${printable(id)}" claims ${size} bytes, file has ${available}`);
    } else if (id === 'ds64' && container !== 'RIFF' && chunks.length === 1) {
      ds64 = parseDs64(await readSmallBody(handle, body, size, 28 + 12 * 64));
    } else if (id === 'fmt ') {
      fmt = parseFmt(await readSmallBody(handle, body, size, 64));
    } else if (id === 'fact' && size >= 4) {
      factSampleLength = (await readSmallBody(handle, body, size, 4)).readUInt32LE(0);
    } else if (id === 'bext') {
      bext = parseBext(await readSmallBody(handle, body, size, 602));
    }
    position = await nextChunkOffset(handle, body, size, fileSize);
  }

  if (container !== 'RIFF' && !ds64) throw new WavError('malformed', `malformed: ${container} file without a ds64 chunk`);
  if (!fmt) throw new WavError('malformed', 'malformed: no fmt chunk');
  if (!data) throw new WavError('malformed', 'malformed: no data chunk');
  if (container !== 'RIFF' && ds64 && ds64.sampleCount > 0) factSampleLength = ds64.sampleCount;
  return {
    container,
    ...fmt,
    dataOffset: data.offset,
    dataBytes: data.size,
    frames: Math.floor(data.size / fmt.blockAlign),
    factSampleLength,
    bext,
    chunks,
    fileSize,
  };
}

interface PendingRead {
  promise: Promise<number>;
  buffer: Uint8Array;
}

/**
 * Sequential block reader over the data chunk. Each read decodes one block into caller-owned
 * per-channel Float32Arrays and has already started the next disk read, so decoding overlaps I/O.
 */
export class WavReader {
  readonly info: WavInfo;
  readonly framesPerBlock: number;
  private readonly handle: FileHandle;
  private readonly buffers: [Uint8Array, Uint8Array];
  private nextFrame = 0;
  private pending: PendingRead | null = null;
  private flip = 0;

  private constructor(handle: FileHandle, info: WavInfo, blockFrames: number) {
    this.handle = handle;
    this.info = info;
    this.framesPerBlock = Math.max(1, Math.floor(blockFrames));
    const bytes = this.framesPerBlock * info.blockAlign;
    // Separate ArrayBuffers at offset 0 so 16/32/64-bit views over them are always aligned.
    this.buffers = [new Uint8Array(new ArrayBuffer(bytes)), new Uint8Array(new ArrayBuffer(bytes))];
  }

  /** `blockFrames` defaults to about 256 KiB of file bytes per read, a multiple of 256 frames. */
  static async open(path: string, opts: { blockFrames?: number } = {}): Promise<WavReader> {
    let handle: FileHandle;
    try {
      handle = await open(path, 'r');
    } catch (error) {
      throw new WavError('io', `cannot open the file (${(error as NodeJS.ErrnoException).code ?? String(error)})`);
    }
    try {
      const { size } = await handle.stat();
      const info = await readWavInfo(handle, size);
      const defaultFrames = Math.max(256, Math.floor(DEFAULT_BLOCK_BYTES / info.blockAlign / 256) * 256);
      return new WavReader(handle, info, opts.blockFrames ?? defaultFrames);
    } catch (error) {
      await handle.close();
      throw error;
    }
  }

  private startRead(frame: number): PendingRead | null {
    const frames = Math.min(this.framesPerBlock, this.info.frames - frame);
    if (frames <= 0) return null;
    const buffer = this.buffers[this.flip];
    this.flip ^= 1;
    const bytes = frames * this.info.blockAlign;
    const position = this.info.dataOffset + frame * this.info.blockAlign;
    const promise = this.handle.read(buffer, 0, bytes, position).then(({ bytesRead }) => {
      if (bytesRead < bytes) {
        throw new WavError('truncated', `truncated: data chunk claims ${this.info.dataBytes} bytes, file ended while reading`);
      }
      return frames;
    });
    // Keep a rejected prefetch from being reported as unhandled before someone awaits it.
    promise.catch(() => undefined);
    return { promise, buffer };
  }

  /** Decodes the next block into `into[c]` from `offset`; returns the frame count, 0 at the end. */
  async read(into: Float32Array[], offset = 0): Promise<number> {
    const current = this.pending ?? this.startRead(this.nextFrame);
    if (!current) return 0;
    const frames = await current.promise;
    this.nextFrame += frames;
    this.pending = this.startRead(this.nextFrame);
    decodeFrames(current.buffer, frames, this.info, into, offset);
    return frames;
  }

  /** Reads an arbitrary window (for pair correlation) without disturbing the sequential reader. */
  async readWindow(startFrame: number, frames: number, into: Float32Array[], offset = 0): Promise<number> {
    const first = Math.max(0, Math.min(startFrame, this.info.frames));
    const count = Math.max(0, Math.min(frames, this.info.frames - first));
    const bytes = count * this.info.blockAlign;
    const buffer = new Uint8Array(new ArrayBuffer(bytes));
    const { bytesRead } = await this.handle.read(buffer, 0, bytes, this.info.dataOffset + first * this.info.blockAlign);
    if (bytesRead < bytes) throw new WavError('truncated', 'truncated: file ended while reading a window');
    decodeFrames(buffer, count, this.info, into, offset);
    return count;
  }

  async close(): Promise<void> {
    if (this.pending) await this.pending.promise.catch(() => undefined);
    this.pending = null;
    await this.handle.close();
  }
}

/** Header-only look at a file, for tools that need the format without reading audio. */
export async function probeWav(path: string): Promise<WavInfo> {
  const reader = await WavReader.open(path, { blockFrames: 1 });
  await reader.close();
  return reader.info;
}
