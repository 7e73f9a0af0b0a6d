import { kindMeta } from '@shared/kinds/kinds';
import type { RowField } from '@shared/kinds/kind';
import { notMappedNotes } from '@shared/types/mapping-notes';

/** Who or what a row is about, as files head the column: "Specimen", "Sample ID", "Subject no.", "Donor", "Barcode". */
const LABEL_WORDS = 'specimen|sample|patient|individual|subject|donor|participant|person|volunteer|accession|case|tube|barcode|bar code';

const LABEL = new RegExp(`^((${LABEL_WORDS})( (id|identifier|no|nr|number|label|code|name))?|id|identifier|label|lab (no|number)|sid|pid)$`);
const NOTE = /^(note|notes|comment|comments|remark|remarks)$/i;

/**
 * The fields a file column can fill for a kind of study: its row fields that files head in a known way
 * (RowField.importHeader), the label, and the note (the exclusion needs a person and is never imported).
 */
export const importFields = (kind: string): string[] =>
  [...kindMeta(kind).rowFields.filter((f) => f.field === 'label' || f.importHeader).map((f) => f.field), 'note'];

/** The fields an import cannot do without: the kind's required fields ('comparative', 'candidate'; 'value'; …). */
export const neededFields = (kind: string): RowField[] => kindMeta(kind).rowFields.filter((f) => f.required);

/** "Sample_ID", " sample-id ", "Subject No." → "sample id", "subject no": lower case, separators as single spaces. */
export const headerWords = (header: string): string => header.toLowerCase().replace(/[_\-.#:/()]+/g, ' ').replace(/\s+/g, ' ').trim();

/** Guesses which column holds which field from the header names; the user confirms or changes it. */
export function suggestMapping(kind: string, columns: string[], rows: string[][]): Record<string, string> {
  const fields = importFields(kind);
  const meta = kindMeta(kind);
  const matches = (field: string, column: string): boolean => {
    if (field === 'label') return LABEL.test(headerWords(column));
    if (field === 'note') return NOTE.test(column.trim());
    return meta.rowFields.find((f) => f.field === field)?.importHeader?.test(column.trim()) ?? false;
  };
  const mapping: Record<string, string> = {};
  const used = new Set<string>();
  for (const f of fields) {
    const hit = columns.find((c) => !used.has(c) && matches(f, c));
    if (hit) { mapping[f] = hit; used.add(hit); }
  }
  const numeric = columns.filter((c, i) => !used.has(c) && rows.slice(0, 20).some((r) => /^[+-]?\d+([.,]\d+)?$/.test(r[i] ?? '')));
  // A result left without a header match takes the next column of numbers.
  for (const f of neededFields(kind).filter((n) => n.type === 'result').map((n) => n.field)) if (!mapping[f] && numeric.length) mapping[f] = numeric.shift()!;
  return mapping;
}

/** The preview's words for the optional fields a mapping leaves without a column ("Not mapped: specimen label — …"). */
export const unmappedNotes = (kind: string, mapping: Record<string, string>): string[] => notMappedNotes(importFields(kind), mapping);
