// archiver 8 ships no types; the part of its API the delivery zip uses (node-archiver's README).
declare module 'archiver' {
  import type { Readable, Transform } from 'node:stream';
  export class ZipArchive extends Transform {
    constructor(options?: { store?: boolean; forceZip64?: boolean; comment?: string });
    append(source: Readable | Buffer | string, data: { name: string; date?: Date; store?: boolean }): this;
    finalize(): Promise<void>;
    pointer(): number;
    abort(): this;
  }
}
