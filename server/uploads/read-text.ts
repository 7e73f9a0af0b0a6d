import { TableBuilder, type ParsedTable } from './table-builder';
import { columnLetter, refuse } from './upload-limits';

/** The delimiter a text file uses: tab for .txt/.tsv or when the first line holds one, else semicolon or comma, whichever the first line has more of. */
export function guessDelimiter(text: string, ext: string): string {
  const firstLine = text.slice(0, text.search(/\r|\n|$/));
  if (ext !== 'csv' || firstLine.includes('\t')) return '\t';
  return firstLine.split(';').length > firstLine.split(',').length ? ';' : ',';
}

/**
 * Reads comma-, semicolon- or tab-separated text (quotes as in RFC 4180: a value in double quotes
 * may hold the delimiter, line breaks and "" for a quote) into a table, refusing the file at the
 * first limit it passes. A reader of our own, because the text is already in memory (at most the
 * 5 MB upload) and this way every limit is checked as the values are met, and a stray quote is
 * named rather than left to a parser's generic error.
 */
export function readDelimited(text: string, delimiter: string): ParsedTable {
  const table = new TableBuilder();
  let row: string[] = [];
  let line = 1;
  let rowLine = 1;
  let i = 0;
  const where = () => `file row ${rowLine}, column ${columnLetter(row.length)}`;
  const push = (value: string) => {
    TableBuilder.checkCell(value, where);
    if (value.trim() !== '') TableBuilder.checkColumn(row.length, where);
    row.push(value);
  };
  const endRow = () => {
    table.addRow(row);
    row = [];
    rowLine = line;
  };
  while (i <= text.length) {
    if (text[i] === '"') {
      let value = '';
      let from = i + 1;
      for (;;) {
        const q = text.indexOf('"', from);
        if (q < 0) refuse(`file row ${rowLine}: a value opens a quote (") that is never closed; check the quotes in the file`);
        value += text.slice(from, q);
        for (let k = from; k < q; k++) if (text[k] === '\n' || (text[k] === '\r' && text[k + 1] !== '\n')) line++;
        TableBuilder.checkCell(value, where);
        if (text[q + 1] === '"') { value += '"'; from = q + 2; continue; }
        i = q + 1;
        break;
      }
      push(value);
      const next = text[i];
      if (next !== undefined && next !== delimiter && next !== '\n' && next !== '\r') {
        refuse(`file row ${rowLine}, column ${columnLetter(row.length - 1)}: a quoted value is followed by other characters before the next ${delimiter === '\t' ? 'tab' : `"${delimiter}"`}; check the quotes in the file`);
      }
    } else {
      let end = i;
      while (end < text.length && text[end] !== delimiter && text[end] !== '\n' && text[end] !== '\r') end++;
      push(text.slice(i, end));
      i = end;
    }
    // i is now at a delimiter, a line break or the end of the text.
    if (text[i] === delimiter) { i++; continue; }
    if (text[i] === '\r' && text[i + 1] === '\n') i++;
    i++;
    line++;
    endRow();
  }
  return table.finish();
}
