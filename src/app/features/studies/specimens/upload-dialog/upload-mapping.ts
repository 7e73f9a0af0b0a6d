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
