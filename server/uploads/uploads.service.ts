import { and, eq, sql } from 'drizzle-orm';
import { type ImportBody, type SpecimenRows, type UploadPreview } from '@shared/schemas';
import { recordAudit } from '../audit/audit';
import { sha256Hex } from '../audit/canonical-json';
import { actorOf, SignedInUser } from '../auth/session-user';
import type { Database } from '../db/client';
import { specimens, uploads } from '../db/schema';
import { AppError, invalid, notFound } from '../http/app-error';
import { loadRows } from '../specimens/input-hash';
import { asClean, cleanRowsFor, writeRows } from '../specimens/specimens.service';
import { findStudy } from '../studies/studies.repository';
import { assertEditable } from '../studies/study-rules';
import { neededFields, suggestMapping, unmappedNotes } from './column-mapping';
import { kindMeta } from '@shared/kinds/kinds';
import type { ParsedTable } from './parse-file';
import { uploadParser } from './parse-pool';
import { scopeOf } from '../db/lab-scope';

/**
 * Stores the original file with its SHA-256 and answers the preview; nothing touches the rows yet. The preview
 * warns of labels the file repeats (the study's, or its own; label-checks.ts) and of fields left unmapped, and
 * suggests replacing the rows rather than adding after them when the file repeats most of the study's labels.
 * The file is read in a worker before any transaction opens (reading may take seconds); the study
 * is checked before reading and again, under lock, in the transaction that stores the upload.
 */
export async function receiveUpload(db: Database, me: SignedInUser, studyId: number, file: { originalname: string; mimetype: string; buffer: Buffer } | undefined): Promise<UploadPreview> {
  if (!file) throw invalid('file', 'Choose a file to upload (field "file")');
  assertEditable(await findStudy(db, scopeOf(me), studyId));
  const studyLabels = (await db.select({ label: specimens.label }).from(specimens).where(eq(specimens.studyId, studyId))).map((r) => r.label);
  const table = await uploadParser().parse(file.originalname, file.buffer, studyLabels);
  const sha256 = sha256Hex(file.buffer);
  const json = Buffer.from(table.json.buffer, table.json.byteOffset, table.json.byteLength); // UTF-8, stored as it came from the worker
  return db.transaction(async (tx) => {
    const study = await findStudy(tx, scopeOf(me), studyId, true);
    assertEditable(study);
    const [row] = await tx.insert(uploads).values(scopeOf(me).values({
      studyId, fileName: file.originalname, mediaType: file.mimetype, size: file.buffer.length,
      sha256, bytes: file.buffer, parsed: sql`convert_from(${json}, 'UTF8')::jsonb`, uploadedBy: me.id,
    })).returning({ id: uploads.id });
    await recordAudit(tx, actorOf(me), { action: 'upload.received', entity: 'upload', entityId: row.id, studyId, after: { fileName: file.originalname, size: file.buffer.length, sha256, rows: table.rowCount } });
    const suggestedMapping = suggestMapping(study.kind, table.columns, table.sample);
    const labels = suggestedMapping.label ? table.labelChecks[suggestedMapping.label] : undefined;
    return {
      uploadId: row.id, fileName: file.originalname, sha256, columns: table.columns, preview: table.sample.slice(0, 10), rowCount: table.rowCount,
      suggestedMapping, warnings: [...(labels?.warnings ?? []), ...unmappedNotes(study.kind, suggestedMapping)], labelChecks: table.labelChecks,
      suggestedMode: studyLabels.length > 0 && !labels?.repeatsMostOfStudy ? 'append' : 'replace',
    };
  });
}

/** Imports an upload with the user's column mapping, replacing or appending rows in one transaction. */
export async function importUpload(db: Database, me: SignedInUser, studyId: number, uploadId: number, body: ImportBody): Promise<SpecimenRows> {
  return db.transaction(async (tx) => {
    const study = await findStudy(tx, scopeOf(me), studyId, true);
    assertEditable(study);
    const [upload] = await tx.select().from(uploads).where(and(eq(uploads.id, uploadId), eq(uploads.studyId, study.id)));
    if (!upload) throw notFound('Upload');
    const table = upload.parsed as ParsedTable;
    const fields: readonly string[] = [...kindMeta(study.kind).rowFields.map((f) => f.field), 'excluded', 'exclusionReason', 'note'];
    for (const [field, column] of Object.entries(body.mapping)) {
      if (!fields.includes(field)) throw invalid(`mapping.${field}`, `"${field}" is not a field of this study's rows`);
      if (!table.columns.includes(column)) throw invalid(`mapping.${field}`, `The file has no column "${column}"`);
    }
    for (const f of neededFields(study.kind)) {
      const what = f.field === 'value' ? 'values' : f.type === 'result' ? `${f.field} results` : f.words;
      if (!body.mapping[f.field]) throw invalid(`mapping.${f.field}`, `Choose the column that holds the ${what}`);
    }
    const raw = table.rows.map((r) => Object.fromEntries(Object.entries(body.mapping).map(([f, c]) => [f, r[table.columns.indexOf(c)]])));
    const offset = table.hasHeader ? 1 : 0;
    const imported = await cleanRowsFor(tx, study, raw.map((r) => ({ ...r, excluded: false }))).catch((err) => {
      throw err instanceof AppError ? fileRows(err, offset) : err;
    });
    const existing = body.mode === 'append' ? await loadRows(tx, study.id) : [];
    const kept = existing.map(asClean);
    const uploadIds = [...existing.map((r) => r.uploadId), ...imported.map(() => upload.id)];
    await tx.update(uploads).set({ importedAt: new Date() }).where(eq(uploads.id, upload.id));
    return writeRows(tx, me, study, body.version, [...kept, ...imported], body.mode === 'append' ? 'specimens.imported.appended' : 'specimens.imported.replaced', uploadIds);
  });
}

/** Row numbers in messages follow the file (its header counts as line 1). */
function fileRows(err: AppError, offset: number): AppError {
  const fix = (m: string) => m.replace(/\brow (\d+)/g, (_, n) => `file row ${Number(n) + offset}`);
  return new AppError(err.code, fix(err.message), err.issues.map((i) => ({ ...i, message: fix(i.message) })));
}
