import type { MessagePort } from 'node:worker_threads';
import { Piscina } from 'piscina';
import type { LabelCheck } from '@shared/schemas';
import { labelChecks } from './label-checks';
import { parseUpload } from './parse-file';
import { Refusal } from './upload-limits';

/** studyLabels: the labels of the study's rows now, to check the file's against (label-checks.ts). */
export interface ParseRequest { fileName: string; bytes: Uint8Array; port: MessagePort; studyLabels?: string[] }

/** What the worker hands back: small parts to answer with, and the whole table as JSON text to store. */
export type ParseResult =
  | { ok: true; columns: string[]; rowCount: number; sample: string[][]; labelChecks: Record<string, LabelCheck>; json: Uint8Array }
  | { ok: false; message: string };

/**
 * The piscina task: reads one upload off the API thread. It says "started" on the port so the
 * time budget counts from here, not from the queue. The table goes back as UTF-8 JSON in a buffer
 * of its own, moved (not copied) to the API thread, which hands it to PostgreSQL as it is: the API
 * thread never walks the cells nor encodes megabytes of text. The labels of every column are checked
 * against the study's here too (label-checks.ts), for the same reason.
 */
export default async function task({ fileName, bytes, port, studyLabels = [] }: ParseRequest): Promise<ParseResult> {
  port.postMessage('started');
  port.close();
  try {
    const table = await parseUpload(fileName, Buffer.from(bytes.buffer, bytes.byteOffset, bytes.byteLength));
    const json = new TextEncoder().encode(JSON.stringify(table));
    const result: ParseResult = {
      ok: true, columns: table.columns, rowCount: table.rows.length, sample: table.rows.slice(0, 20),
      labelChecks: labelChecks(table.columns, table.rows, studyLabels), json,
    };
    return Piscina.move({ [Piscina.transferableSymbol]: [json.buffer], [Piscina.valueSymbol]: result } as never) as unknown as ParseResult;
  } catch (err) {
    if (err instanceof Refusal) return { ok: false, message: err.message };
    throw err;
  }
}
