import { notMappedNotes } from '../../shared/types/mapping-notes';

/** Who or what a row is about, as files head the column: "Specimen", "Sample ID", "Subject no.", "Donor", "Barcode". */
const LABEL_WORDS = 'specimen|sample|patient|individual|subject|donor|participant|person|volunteer|accession|case|tube|barcode|bar code';

const PATTERNS: Record<string, RegExp> = {
  label: new RegExp(`^((${LABEL_WORDS})( (id|identifier|no|nr|number|label|code|name))?|id|identifier|label|lab (no|number)|sid|pid)$`),
  comparative: /(comparative|current|reference|old|^x$)/i,
  candidate: /(candidate|new|test|^y$)/i,
  value: /^(value|result|concentration)$/i,
  sex: /^(sex|gender)$/i,
  ageBand: /^(age.?band|age.?group|age.?range|age)$/i,
  note: /^(note|notes|comment|comments|remark|remarks)$/i,
};

/** The fields a file column can fill for a kind of study (the exclusion needs a person and is never imported). */
export const importFields = (kind: string): string[] =>
  kind === 'method-comparison' ? ['label', 'comparative', 'candidate', 'note'] : ['label', 'value', 'sex', 'ageBand', 'note'];

/** "Sample_ID", " sample-id ", "Subject No." → "sample id", "subject no": lower case, separators as single spaces. */
export const headerWords = (header: string): string => header.toLowerCase().replace(/[_\-.#:/()]+/g, ' ').replace(/\s+/g, ' ').trim();

const matches = (field: string, column: string): boolean =>
  field === 'label' ? PATTERNS.label.test(headerWords(column)) : PATTERNS[field].test(column.trim());

/** Guesses which column holds which field from the header names; the user confirms or changes it. */
export function suggestMapping(kind: string, columns: string[], rows: string[][]): Record<string, string> {
  const fields = importFields(kind);
  const mapping: Record<string, string> = {};
  const used = new Set<string>();
  for (const f of fields) {
    const hit = columns.find((c) => !used.has(c) && matches(f, c));
    if (hit) { mapping[f] = hit; used.add(hit); }
  }
  const numeric = columns.filter((c, i) => !used.has(c) && rows.slice(0, 20).some((r) => /^[+-]?\d+([.,]\d+)?$/.test(r[i] ?? '')));
  const needed = kind === 'method-comparison' ? ['comparative', 'candidate'] : ['value'];
  for (const f of needed) if (!mapping[f] && numeric.length) mapping[f] = numeric.shift()!;
  return mapping;
}

/** The preview's words for the optional fields a mapping leaves without a column ("Not mapped: specimen label — …"). */
export const unmappedNotes = (kind: string, mapping: Record<string, string>): string[] => notMappedNotes(importFields(kind), mapping);
