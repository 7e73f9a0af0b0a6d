import { once } from 'node:events';
import zlib from 'node:zlib';

/*
 * Test helpers: workbooks written byte by byte, so tests can build what no spreadsheet program
 * writes (zip bombs, parts whose header lies about their size, a million rows in a few MB).
 * yauzl reads zips but cannot write them, hence this small writer of the zip format.
 */

export interface ZipPart {
  name: string;
  /** The part's content, or an already deflated body with its true size and CRC (see `deflated`). */
  data: string | Buffer | Deflated;
  /** A size to write in the headers instead of the true one (a lying header). */
  declaredSize?: number;
}

export interface Deflated { body: Buffer; size: number; crc: number }

/** Deflates text given in pieces, without ever holding the inflated whole (tests deflate hundreds of MB). */
export async function deflate(pieces: Iterable<string>): Promise<Deflated> {
  const deflater = zlib.createDeflateRaw({ level: 9 });
  const chunks: Buffer[] = [];
  deflater.on('data', (c: Buffer) => chunks.push(c));
  const ended = once(deflater, 'end');
  let crc = 0;
  let size = 0;
  for (const piece of pieces) {
    const b = Buffer.from(piece);
    crc = zlib.crc32(b, crc);
    size += b.length;
    if (!deflater.write(b)) await once(deflater, 'drain');
  }
  deflater.end();
  await ended;
  return { body: Buffer.concat(chunks), size, crc };
}

/** `row(i)` for i below `count`, joined in batches, so a million rows never make one big string. */
export function* rows(count: number, row: (i: number) => string, batch = 10_000): Generator<string> {
  for (let from = 0; from < count; from += batch) {
    let text = '';
    for (let i = from; i < Math.min(count, from + batch); i++) text += row(i);
    yield text;
  }
}

/** A sheet part's XML around `count` rows, in pieces for `deflate`. */
export function* sheetPieces(count: number, row: (i: number) => string): Generator<string> {
  yield SHEET_HEAD;
  yield* rows(count, row);
  yield SHEET_TAIL;
}

/** `head`, then `unit` `times` times, then `tail`, deflated. */
export function deflated(head: string, unit: string, times: number, tail = ''): Promise<Deflated> {
  const perBatch = Math.max(1, Math.floor((1 << 20) / unit.length));
  const batch = unit.repeat(perBatch);
  return deflate((function* () {
    yield head;
    let left = times;
    for (; left >= perBatch; left -= perBatch) yield batch;
    yield unit.repeat(left);
    yield tail;
  })());
}

/** Writes a zip of the parts (deflated, or stored when `data` is already a Deflated body). */
export function writeZip(parts: ZipPart[]): Buffer {
  const locals: Buffer[] = [];
  const centrals: Buffer[] = [];
  let offset = 0;
  for (const part of parts) {
    const name = Buffer.from(part.name);
    let body: Buffer; let size: number; let crc: number;
    if (typeof part.data === 'string' || Buffer.isBuffer(part.data)) {
      const raw = Buffer.from(part.data);
      body = zlib.deflateRawSync(raw);
      size = raw.length;
      crc = zlib.crc32(raw);
    } else {
      ({ body, size, crc } = part.data);
    }
    const declared = part.declaredSize ?? size;
    const local = Buffer.alloc(30);
    local.writeUInt32LE(0x04034b50, 0);
    local.writeUInt16LE(20, 4);
    local.writeUInt16LE(0x0800, 6);
    local.writeUInt16LE(8, 8);
    local.writeUInt32LE(crc >>> 0, 14);
    local.writeUInt32LE(body.length, 18);
    local.writeUInt32LE(declared, 22);
    local.writeUInt16LE(name.length, 26);
    const central = Buffer.alloc(46);
    central.writeUInt32LE(0x02014b50, 0);
    central.writeUInt16LE(20, 4);
    central.writeUInt16LE(20, 6);
    central.writeUInt16LE(0x0800, 8);
    central.writeUInt16LE(8, 10);
    central.writeUInt32LE(crc >>> 0, 16);
    central.writeUInt32LE(body.length, 20);
    central.writeUInt32LE(declared, 24);
    central.writeUInt16LE(name.length, 28);
    central.writeUInt32LE(offset, 42);
    locals.push(local, name, body);
    centrals.push(central, name);
    offset += local.length + name.length + body.length;
  }
  const directory = Buffer.concat(centrals);
  const end = Buffer.alloc(22);
  end.writeUInt32LE(0x06054b50, 0);
  end.writeUInt16LE(parts.length, 8);
  end.writeUInt16LE(parts.length, 10);
  end.writeUInt32LE(directory.length, 12);
  end.writeUInt32LE(offset, 16);
  return Buffer.concat([...locals, directory, end]);
}

const NS = 'http://schemas.openxmlformats.org/officeDocument/2006/relationships';
const PKG = 'http://schemas.openxmlformats.org/package/2006/relationships';

/** The parts every workbook needs around its sheet: content types, relationships, workbook. */
export function workbookParts(options: { sharedStrings?: boolean; styles?: string; date1904?: boolean } = {}): ZipPart[] {
  const rel = (id: string, type: string, target: string) => `<Relationship Id="${id}" Type="${NS}/${type}" Target="${target}"/>`;
  return [
    { name: '[Content_Types].xml', data: '<?xml version="1.0"?><Types xmlns="http://schemas.openxmlformats.org/package/2006/content-types"/>' },
    { name: '_rels/.rels', data: `<?xml version="1.0"?><Relationships xmlns="${PKG}">${rel('rId1', 'officeDocument', 'xl/workbook.xml')}</Relationships>` },
    { name: 'xl/workbook.xml', data: `<?xml version="1.0"?><workbook xmlns="http://schemas.openxmlformats.org/spreadsheetml/2006/main" xmlns:r="${NS}">${options.date1904 ? '<workbookPr date1904="1"/>' : ''}<sheets><sheet name="Results" sheetId="1" r:id="rId1"/></sheets></workbook>` },
    { name: 'xl/_rels/workbook.xml.rels', data: `<?xml version="1.0"?><Relationships xmlns="${PKG}">${rel('rId1', 'worksheet', 'worksheets/sheet1.xml')}${options.sharedStrings ? rel('rId2', 'sharedStrings', 'sharedStrings.xml') : ''}${options.styles ? rel('rId3', 'styles', 'styles.xml') : ''}</Relationships>` },
    ...(options.styles ? [{ name: 'xl/styles.xml', data: options.styles }] : []),
  ];
}

/** A sheet part around the given rows XML. */
export const sheetXml = (rows: string) => `<?xml version="1.0"?><worksheet xmlns="http://schemas.openxmlformats.org/spreadsheetml/2006/main"><sheetData>${rows}</sheetData></worksheet>`;
export const SHEET_HEAD = '<?xml version="1.0"?><worksheet xmlns="http://schemas.openxmlformats.org/spreadsheetml/2006/main"><sheetData>';
export const SHEET_TAIL = '</sheetData></worksheet>';
