/**
 * What an import leaves out when a field has no column mapped to it, in words for the import preview.
 * Results are not here: without their column an import is refused, so the preview asks for them instead.
 */
const OPTIONAL_FIELDS: readonly { field: string; words: string }[] = [
  { field: 'label', words: 'specimen label' },
  { field: 'sex', words: 'sex' },
  { field: 'ageBand', words: 'age band' },
  { field: 'note', words: 'note' },
];

/**
 * The notes for the optional fields among `fields` that `mapping` leaves without a column: the label on a
 * line of its own (unlabelled rows cannot be told apart), the others together, e.g.
 * "Not mapped: specimen label — no column of the file is chosen for it; the rows come in unlabelled",
 * "Not mapped: sex, age band, note — no column of the file is chosen for them; the rows come in without them".
 */
export function notMappedNotes(fields: readonly string[], mapping: Readonly<Record<string, string>>): string[] {
  const missing = OPTIONAL_FIELDS.filter((f) => fields.includes(f.field) && !mapping[f.field]);
  const notes: string[] = [];
  if (missing.some((f) => f.field === 'label')) notes.push('Not mapped: specimen label — no column of the file is chosen for it; the rows come in unlabelled');
  const others = missing.filter((f) => f.field !== 'label').map((f) => f.words);
  if (others.length === 1) notes.push(`Not mapped: ${others[0]} — no column of the file is chosen for it; the rows come in without it`);
  else if (others.length > 1) notes.push(`Not mapped: ${others.join(', ')} — no column of the file is chosen for them; the rows come in without them`);
  return notes;
}
