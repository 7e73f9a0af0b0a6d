import { StringDecoder } from 'node:string_decoder';
import { Readable, Transform, type TransformCallback } from 'node:stream';
import yauzl from 'yauzl';
import { MESSAGES, Refusal, UPLOAD_LIMITS, refuse } from './upload-limits';

const NOT_READABLE = 'The workbook could not be read; save it again as .xlsx and retry';

/**
 * Counts the inflated bytes of the parts read so far against one budget and refuses the workbook
 * the moment the budget is spent; passes the text on decoded (UTF-8 across chunk boundaries).
 */
export class InflatedText extends Transform {
  private readonly decoder = new StringDecoder('utf8');

  constructor(private readonly budget: { left: number }) {
    super({ readableObjectMode: true });
  }

  override _transform(chunk: Buffer, _encoding: BufferEncoding, done: TransformCallback): void {
    this.budget.left -= chunk.length;
    if (this.budget.left < 0) return done(new Refusal(MESSAGES.inflated()));
    const text = this.decoder.write(chunk);
    if (text) this.push(text);
    done();
  }

  override _flush(done: TransformCallback): void {
    const text = this.decoder.end();
    if (text) this.push(text);
    done();
  }
}

/**
 * The parts of a workbook's zip, found through its central directory (yauzl, random access), so a
 * part is inflated only when asked for and parts that are never asked for are never inflated.
 */
export class ZipParts {
  private readonly budget = { left: UPLOAD_LIMITS.inflatedBytes };

  private constructor(private readonly zip: yauzl.ZipFile, private readonly entries: Map<string, yauzl.Entry>) {}

  /** Reads the zip directory; refuses a file that is not a zip or lists more entries than the limit. */
  static async open(bytes: Buffer): Promise<ZipParts> {
    const zip = await yauzl.fromBufferPromise(bytes, { lazyEntries: true, validateEntrySizes: true, decodeStrings: true }).catch(() => refuse(NOT_READABLE));
    if (zip.entryCount > UPLOAD_LIMITS.zipEntries) {
      zip.close();
      refuse(MESSAGES.zipEntries());
    }
    const entries = new Map<string, yauzl.Entry>();
    await new Promise<void>((resolve, reject) => {
      zip.on('entry', (entry: yauzl.Entry) => {
        entries.set(entry.fileName, entry);
        zip.readEntry();
      });
      zip.once('end', resolve);
      zip.once('error', () => reject(new Refusal(NOT_READABLE)));
      zip.readEntry();
    });
    return new ZipParts(zip, entries);
  }

  has(name: string): boolean {
    return this.entries.has(name);
  }

  /**
   * The text of one part as a stream of strings. Refuses before inflating when the part's declared
   * size alone passes what is left of the budget; counts the real bytes while inflating (the
   * declared size may lie: yauzl's validateEntrySizes also stops a part that inflates to more).
   */
  async text(name: string): Promise<Readable> {
    const entry = this.entries.get(name);
    if (!entry) refuse(`The workbook has no part ${name}; save it again as .xlsx and retry`);
    if (entry!.uncompressedSize > this.budget.left) refuse(MESSAGES.inflated());
    const source = await this.zip.openReadStreamPromise(entry!).catch(() => refuse(NOT_READABLE));
    const out = new InflatedText(this.budget);
    source.on('error', (err: Error) => out.destroy(/bytes in the stream/.test(err.message)
      ? new Refusal(`The workbook is damaged: its part ${name} does not have the size the file declares for it; save it again as .xlsx and retry`)
      : new Refusal(NOT_READABLE)));
    out.on('close', () => source.destroy());
    return source.pipe(out);
  }

  close(): void {
    this.zip.close();
  }
}
