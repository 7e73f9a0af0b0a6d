import type { LabelCheck, UploadPreview } from '@shared/schemas';
import { notMappedNotes } from '@shared/types/mapping-notes';
import type { SpecimenLayout } from '../specimen-layout';

/** A field a file column can be mapped to; results must be mapped, the others may be. */
export interface MappableField {
  field: string;
  header: string;
  required: boolean;
}

/** The fields an import can fill: the layout's results and free texts, but not the exclusion (that needs a person). */
export function mappableFields(layout: SpecimenLayout): MappableField[] {
  return layout.fields
    .filter((f) => f.kind !== 'flag' && f.field !== 'exclusionReason')
    .map((f) => ({ field: f.field, header: f.header, required: f.kind === 'result' }));
}

/** The server's suggested mapping, kept only where it names a column that exists. */
export function startingMapping(fields: readonly MappableField[], suggested: Record<string, string>, columns: readonly string[]): Record<string, string> {
  const mapping: Record<string, string> = {};
  for (const f of fields) if (suggested[f.field] && columns.includes(suggested[f.field])) mapping[f.field] = suggested[f.field];
  return mapping;
}

/** What is still wrong with a mapping, in words (empty when it can be imported). */
export function mappingProblems(fields: readonly MappableField[], mapping: Record<string, string>): string[] {
  const problems = fields.filter((f) => f.required && !mapping[f.field]).map((f) => `Choose the column for ${f.header.toLowerCase()}.`);
  const used = Object.values(mapping).filter(Boolean);
  const twice = used.filter((c, i) => used.indexOf(c) !== i);
  for (const column of new Set(twice)) problems.push(`The column "${column}" is mapped to more than one field.`);
  return problems;
}

/** The server's check of the column now mapped to the label (labels it would repeat), if it found any. */
export function labelCheckOf(preview: UploadPreview, mapping: Record<string, string>): LabelCheck | null {
  const column = mapping['label'];
  return (column && preview.labelChecks?.[column]) || null;
}

/**
 * What the preview warns of for the mapping as it stands: the labels its label column repeats (the study's, or
 * the file's own), then the optional fields left without a column ("Not mapped: specimen label — …").
 */
export function importWarnings(fields: readonly MappableField[], preview: UploadPreview, mapping: Record<string, string>): string[] {
  return [...(labelCheckOf(preview, mapping)?.warnings ?? []), ...notMappedNotes(fields.map((f) => f.field), mapping)];
}

/**
 * Until the user chooses: add after the rows when the grid holds some, but replace them when the file repeats
 * most of the study's labels (it is most likely the same rows again), and replace an empty grid.
 */
export function defaultMode(rowCount: number, check: LabelCheck | null): 'replace' | 'append' {
  return rowCount > 0 && !check?.repeatsMostOfStudy ? 'append' : 'replace';
}
