import path from 'node:path/posix';
import type { Readable } from 'node:stream';
import ExcelJS from 'exceljs';
import { parseXml, readDateStyles, readSharedStrings } from './read-parts';
import { TableBuilder, type ParsedTable } from './table-builder';
import { Refusal, columnIndex, columnLetter, refuse } from './upload-limits';
import { ZipParts } from './zip-parts';

/*
 * How a workbook is read. The zip layer is yauzl (ZipParts): parts are found through the central
 * directory and inflated one at a time, against one budget of inflated bytes; parts that are not
 * needed (pictures, properties, other sheets) are never inflated.
 *
 * The relationships and workbook.xml (which sheet is first) are read with exceljs 4.4.0's own
 * streaming readers, WorkbookReader's _parseRels and _parseWorkbook, which take a stream of one
 * part. The parts that can be large are read with saxes (the XML parser exceljs uses) by small
 * readers of our own: shared texts and date styles in read-parts.ts (see there why), and the sheet
 * here, not with exceljs's WorksheetReader, because that reader hands over a row only once the row
 * has closed, after building Row and Cell objects for every cell in it: a single row of millions
 * of cells, or a cell of megabytes, would be built before any limit could be checked. It also
 * keeps only the last run of a rich inline string and stops at a cell without an address. Ours
 * checks the column of each cell and the length of each value as it reads them.
 */

interface Relationship { Id: string; Type: string; Target: string }
/** The internals of exceljs's WorkbookReader that we call; pinned with exceljs at 4.4.0 and covered by read-file.spec.ts. */
interface PartReaders {
  workbookRels?: Relationship[];
  model?: { sheets?: { name: string; rId: string }[] };
  properties?: { model?: { date1904?: boolean } };
  _parseRels(stream: Readable): Promise<void>;
  _parseWorkbook(stream: Readable): Promise<void>;
}
// eslint-disable-next-line @typescript-eslint/no-require-imports
const { excelToDate } = require('exceljs/lib/utils/utils') as { excelToDate(v: number, date1904: boolean): Date };

function partReaders(): PartReaders {
  const reader = new ExcelJS.stream.xlsx.WorkbookReader(undefined as never, { sharedStrings: 'ignore', styles: 'ignore', worksheets: 'ignore', hyperlinks: 'ignore', entries: 'ignore' } as never) as unknown as PartReaders;
  for (const m of ['_parseRels', '_parseWorkbook'] as const) {
    if (typeof reader[m] !== 'function') throw new Error(`exceljs no longer has WorkbookReader.${m}; the upload reader needs it (see read-xlsx.ts)`);
  }
  return reader;
}

/** "xl/workbook.xml" → "xl/_rels/workbook.xml.rels": where a part's relationships are kept. */
const relsOf = (part: string) => path.join(path.dirname(part), '_rels', `${path.basename(part)}.rels`);
/** A relationship's target, relative to the part that holds it unless it starts with "/". */
const resolve = (part: string, target: string) => (target.startsWith('/') ? target.slice(1) : path.normalize(path.join(path.dirname(part), target)));

/**
 * Reads the first sheet of an .xlsx into a table, as a stream, with every limit checked while
 * reading: inflated size, zip entries, rows, columns, characters per cell and in all. Formula cells
 * give their cached result; error cells are refused naming the sheet row and column; rich text is
 * joined; booleans are TRUE/FALSE; dates are yyyy-mm-dd.
 */
export async function readXlsx(bytes: Buffer): Promise<ParsedTable> {
  const zip = await ZipParts.open(bytes);
  try {
    const reader = partReaders();
    const rels = async (part: string): Promise<Relationship[]> => {
      if (!zip.has(relsOf(part))) return [];
      reader.workbookRels = undefined;
      await readPart(zip, relsOf(part), (s) => reader._parseRels(s));
      return reader.workbookRels ?? [];
    };
    const office = (await rels('')).find((r) => r.Type.endsWith('/officeDocument'));
    const workbookPart = office ? resolve('', office.Target) : 'xl/workbook.xml';
    const workbookRels = await rels(workbookPart);
    await readPart(zip, workbookPart, (s) => reader._parseWorkbook(s));
    const first = reader.model?.sheets?.[0];
    const sheetRel = first && workbookRels.find((r) => r.Id === first.rId);
    if (!sheetRel) refuse('The workbook has no sheet');
    const related = (type: string) => workbookRels.filter((r) => r.Type.endsWith(type)).map((r) => resolve(workbookPart, r.Target)).find((p) => zip.has(p));
    const sharedPart = related('/sharedStrings');
    let shared: string[] = [];
    if (sharedPart) await readPart(zip, sharedPart, async (s) => { shared = await readSharedStrings(s); });
    const stylesPart = related('/styles');
    let isDate = (_style: number) => false;
    if (stylesPart) await readPart(zip, stylesPart, async (s) => { isDate = await readDateStyles(s); });
    const sheet = await zip.text(resolve(workbookPart, sheetRel!.Target));
    try {
      return await readSheet(sheet, shared, isDate, reader.properties?.model?.date1904 ?? false);
    } finally {
      sheet.destroy();
    }
  } finally {
    zip.close();
  }
}

async function readPart(zip: ZipParts, name: string, parse: (stream: Readable) => Promise<void>): Promise<void> {
  const stream = await zip.text(name);
  try {
    await parse(stream);
  } catch (err) {
    if (err instanceof Refusal) throw err;
    refuse(`The workbook could not be read (its part ${name} is not valid); save it again as .xlsx and retry`);
  } finally {
    stream.destroy();
  }
}

interface Cell { col: number; type: string; style: number; formula: boolean; value: string; inline: string }

/** Reads the rows of one sheet's XML, checking each cell's column and length as it is read. */
async function readSheet(chunks: AsyncIterable<string>, shared: string[], isDate: (style: number) => boolean, date1904: boolean): Promise<ParsedTable> {
  const table = new TableBuilder();
  let inData = false;
  let rowNumber = 0;
  let cells: string[] = [];
  let cell: Cell | null = null;
  let collect: 'value' | 'inline' | null = null;
  let phonetic = false;
  const where = () => `sheet row ${rowNumber}, column ${columnLetter(cell!.col)}`;

  await parseXml(chunks, {
    open: (name, a) => {
      switch (name) {
        case 'sheetData': inData = true; break;
        case 'row':
          if (!inData) break;
          rowNumber = Number(a.r) || rowNumber + 1;
          cells = [];
          cell = null;
          break;
        case 'c': {
          if (!inData) break;
          const letters = /^([A-Z]+)\d*$/.exec(a.r ?? '')?.[1];
          const col = letters ? columnIndex(letters) : (cell ? cell.col + 1 : 0);
          cell = { col: col < 0 ? 0 : col, type: a.t ?? 'n', style: a.s ? Number(a.s) : 0, formula: false, value: '', inline: '' };
          break;
        }
        case 'f': if (cell) cell.formula = true; break;
        case 'v': if (cell) collect = 'value'; break;
        case 'rPh': phonetic = true; break;
        case 't': if (cell && !phonetic) collect = 'inline'; break;
      }
    },
    text: (text) => {
      if (!collect || !cell) return;
      const grown = cell[collect] + text;
      TableBuilder.checkCell(grown, where);
      cell[collect] = grown;
    },
    close: (name) => {
      switch (name) {
        case 'v': case 't': collect = null; break;
        case 'rPh': phonetic = false; break;
        case 'c':
          if (cell && inData) {
            const text = cellText(cell, shared, isDate, date1904, where);
            TableBuilder.checkCell(text, where);
            if (text.trim() !== '') {
              TableBuilder.checkColumn(cell.col, where);
              cells[cell.col] = text;
            }
          }
          break;
        case 'row': if (inData) table.addRow(cells); cells = []; break;
        case 'sheetData': inData = false; break;
      }
    },
  }, () => `its sheet, near sheet row ${rowNumber},`);
  return table.finish();
}

/** The text of one cell as it would be shown, or a refusal for an error value. */
function cellText(c: Cell, shared: string[], isDate: (style: number) => boolean, date1904: boolean, where: () => string): string {
  const v = c.value;
  switch (c.type) {
    case 's': {
      if (v === '') return '';
      const s = shared[Number(v)];
      if (s === undefined) return refuse(`${where()}: the cell refers to a shared text the workbook does not hold; save it again as .xlsx and retry`);
      return s;
    }
    case 'inlineStr': return c.inline;
    case 'str': return v;
    case 'e': return refuse(c.formula ? `${where()}: the formula gives the error ${v}` : `${where()}: the cell holds the error ${v}; fix it in the workbook and upload again`);
    case 'b': return v === '' ? '' : Number(v) !== 0 ? 'TRUE' : 'FALSE';
    case 'd': return v.slice(0, 10);
    default: {
      if (v === '') return '';
      const n = parseFloat(v);
      if (!Number.isFinite(n)) return v;
      if (c.style && isDate(c.style)) {
        const date = excelToDate(n, date1904);
        if (!Number.isNaN(date.getTime())) return date.toISOString().slice(0, 10);
      }
      return String(n);
    }
  }
}
