/** The parts of archiver 8 (which ships no types) that the channel export uses. */
declare module "archiver" {
  import type { Readable, Transform } from "node:stream";
  export class ZipArchive extends Transform {
    constructor(options?: { zlib?: { level?: number }; forceZip64?: boolean });
    append(source: Readable | Buffer | string, data: { name: string; date?: Date }): this;
    finalize(): Promise<void>;
    abort(): this;
    pointer(): number;
  }
}
