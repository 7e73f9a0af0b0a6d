/**
 * A count with its noun, right for one and for many: plural(1, 'row') → "1 row", plural(3, 'row') →
 * "3 rows", plural(2, 'study', 'studies') → "2 studies", plural(1200, 'value') → "1,200 values".
 * One helper for the client, the server, the e-mails and the PDF, so no text says "row(s)".
 */
export function plural(count: number, one: string, many = `${one}s`): string {
  return `${count.toLocaleString('en-US')} ${nounFor(count, one, many)}`;
}

/** The noun alone, for a count written elsewhere: nounFor(1, 'row') → "row", nounFor(0, 'row') → "rows". */
export function nounFor(count: number, one: string, many = `${one}s`): string {
  return count === 1 ? one : many;
}
