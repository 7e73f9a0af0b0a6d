import { SaxesParser, type SaxesTagPlain } from 'saxes';
import { UPLOAD_LIMITS, refuse } from './upload-limits';

/* eslint-disable @typescript-eslint/no-require-imports */
const { isDateFmt } = require('exceljs/lib/utils/utils') as { isDateFmt(fmt: string): boolean };
const { getDefaultFmtCode } = require('exceljs/lib/xlsx/xform/style/numfmt-xform') as { getDefaultFmtCode(id: number): string | undefined };
/* eslint-enable @typescript-eslint/no-require-imports */

export interface XmlHandlers {
  open?: (name: string, attributes: Record<string, string>) => void;
  text?: (text: string) => void;
  close?: (name: string) => void;
}

/**
 * Feeds the text of one part, chunk by chunk, to saxes (the XML parser exceljs uses) and calls the
 * handlers; refuses the workbook, naming the part (`what()` says where), when the XML is not valid.
 * A handler may throw a Refusal to stop reading at once.
 */
export async function parseXml(chunks: AsyncIterable<string>, handlers: XmlHandlers, what: () => string): Promise<void> {
  const parser = new SaxesParser();
  let failed = false;
  parser.on('error', () => { failed = true; });
  if (handlers.open) parser.on('opentag', (node: SaxesTagPlain) => handlers.open!(node.name, node.attributes));
  if (handlers.text) { parser.on('text', handlers.text); parser.on('cdata', handlers.text); }
  if (handlers.close) parser.on('closetag', (node) => handlers.close!(node.name));
  for await (const chunk of chunks) {
    parser.write(chunk);
    if (failed) break;
  }
  if (!failed) parser.close();
  if (failed) refuse(`The workbook could not be read (${what()} is not valid XML); save it again as .xlsx and retry`);
}

/**
 * The shared texts of sharedStrings.xml, rich text joined, phonetic guides left out. Each is kept
 * only up to one character past the cell limit: a cell that uses a longer one is refused anyway,
 * so a part of 50 MB in a single text never becomes a 50 MB string. (exceljs's own
 * _parseSharedStrings keeps an object per rich-text run: 50 MB of runs took it past 15 s and
 * 256 MB.)
 */
export async function readSharedStrings(chunks: AsyncIterable<string>): Promise<string[]> {
  const strings: string[] = [];
  let current: string | null = null;
  let inText = false;
  let phonetic = false;
  await parseXml(chunks, {
    open: (name) => {
      if (name === 'si') current = '';
      else if (name === 'rPh') phonetic = true;
      else if (name === 't' && current !== null && !phonetic) inText = true;
    },
    text: (text) => {
      if (inText && current!.length <= UPLOAD_LIMITS.cellChars) current += text.slice(0, UPLOAD_LIMITS.cellChars + 1 - current!.length);
    },
    close: (name) => {
      if (name === 't') inText = false;
      else if (name === 'rPh') phonetic = false;
      else if (name === 'si') { strings.push(current ?? ''); current = null; }
    },
  }, () => 'its part of shared texts');
  return strings;
}

/**
 * Which cell styles format numbers as dates: the one thing the reader needs from styles.xml, kept
 * as one number per cell style. (exceljs's _parseStyles builds a model of every font, fill, border
 * and format: 50 MB of styles took it over 10 s and past 256 MB.) Date formats are recognised by
 * exceljs's own rule (isDateFmt) and its table of built-in formats, as before.
 */
export async function readDateStyles(chunks: AsyncIterable<string>): Promise<(style: number) => boolean> {
  const customFormats = new Map<number, string>();
  const styleFormats: number[] = [];
  let inCellXfs = false;
  await parseXml(chunks, {
    open: (name, a) => {
      if (name === 'numFmt') customFormats.set(Number(a.numFmtId), a.formatCode ?? '');
      else if (name === 'cellXfs') inCellXfs = true;
      else if (name === 'xf' && inCellXfs) styleFormats.push(Number(a.numFmtId ?? 0));
    },
    close: (name) => { if (name === 'cellXfs') inCellXfs = false; },
  }, () => 'its part of styles');
  const known = new Map<number, boolean>();
  return (style) => {
    const format = styleFormats[style];
    if (format === undefined) return false;
    if (!known.has(format)) known.set(format, isDateFmt(customFormats.get(format) ?? getDefaultFmtCode(format) ?? ''));
    return known.get(format)!;
  };
}
