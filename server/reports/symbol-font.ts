/**
 * Open Sans has no arrows, and a report must not depend on a system font. The few symbols it lacks are
 * drawn by a small Type 3 font of our own: each glyph a vector path in a 1000-unit em, with a ToUnicode
 * map so text extraction and search still read the real characters.
 */
interface Glyph { name: string; width: number; box: [number, number, number, number]; path: string }

// Paths in glyph space (y up, baseline 0); filled in the current text colour (d1 glyphs).
const GLYPHS: Record<string, Glyph> = {
  '\u2192': { name: 'arrowright', width: 640, box: [60, 100, 610, 430], path: '70 222 m 440 222 l 440 110 l 600 264 l 440 418 l 440 306 l 70 306 l h f' },
  '\u2190': { name: 'arrowleft', width: 640, box: [30, 100, 580, 430], path: '570 222 m 200 222 l 200 110 l 40 264 l 200 418 l 200 306 l 570 306 l h f' },
};

export const SYMBOL_CHARS = Object.keys(GLYPHS);
export const isSymbol = (char: string): boolean => char in GLYPHS;
export const SYMBOL_FONT_ID = 'FPXSym';

/** Advance width of one symbol at a font size, in points. */
export const symbolWidth = (char: string, size: number): number => (GLYPHS[char].width * size) / 1000;

interface Ref { end(chunk?: string): void }
type RefMaker = { ref(data: object): Ref; addContent(op: string): unknown };

const fonts = new WeakMap<PDFKit.PDFDocument, Ref>();

/** The font object of this document, written once on first use. */
function fontRef(doc: PDFKit.PDFDocument): Ref {
  const existing = fonts.get(doc);
  if (existing) return existing;
  const maker = doc as unknown as RefMaker;
  const glyphs = SYMBOL_CHARS.map((c) => GLYPHS[c]);
  const procs: Record<string, Ref> = {};
  for (const g of glyphs) {
    procs[g.name] = maker.ref({});
    procs[g.name].end(`${g.width} 0 ${g.box.join(' ')} d1\n${g.path}`);
  }
  const toUnicode = maker.ref({});
  const entries = SYMBOL_CHARS.map((c, k) => `<${hex(k + 1, 2)}> <${hex(c.charCodeAt(0), 4)}>`);
  toUnicode.end([
    '/CIDInit /ProcSet findresource begin', '12 dict begin', 'begincmap',
    '/CIDSystemInfo << /Registry (Adobe) /Ordering (UCS) /Supplement 0 >> def', '/CMapName /Parallax-Symbols-UCS def', '/CMapType 2 def',
    '1 begincodespacerange', '<00> <FF>', 'endcodespacerange', `${entries.length} beginbfchar`, ...entries, 'endbfchar',
    'endcmap', 'CMapName currentdict /CMap defineresource pop', 'end', 'end',
  ].join('\n'));
  const font = maker.ref({
    Type: 'Font', Subtype: 'Type3', Name: SYMBOL_FONT_ID,
    FontBBox: [0, -200, 1000, 800], FontMatrix: [0.001, 0, 0, 0.001, 0, 0],
    CharProcs: procs, Encoding: { Type: 'Encoding', Differences: [1, ...glyphs.map((g) => g.name)] },
    FirstChar: 1, LastChar: glyphs.length, Widths: glyphs.map((g) => g.width), Resources: {}, ToUnicode: toUnicode,
  });
  font.end();
  fonts.set(doc, font);
  return font;
}

/**
 * Draws one symbol with its baseline at (x, baseline) in pdfkit's top-down page coordinates, in the
 * current fill colour.
 */
export function drawSymbol(doc: PDFKit.PDFDocument, char: string, x: number, baseline: number, size: number): void {
  const page = doc.page as unknown as { fonts: Record<string, Ref>; height: number };
  page.fonts[SYMBOL_FONT_ID] = fontRef(doc);
  const code = SYMBOL_CHARS.indexOf(char) + 1;
  const maker = doc as unknown as RefMaker;
  doc.save();
  doc.transform(1, 0, 0, -1, 0, page.height);
  maker.addContent(`BT /${SYMBOL_FONT_ID} ${size} Tf 1 0 0 1 ${x.toFixed(3)} ${(page.height - baseline).toFixed(3)} Tm <${hex(code, 2)}> Tj ET`);
  doc.restore();
}

const hex = (value: number, digits: number): string => value.toString(16).toUpperCase().padStart(digits, '0');
