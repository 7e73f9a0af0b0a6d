// Where the text of a PDF stands, page by page: each line's text, its top in points from the top of the page,
// the largest type size on it and its left and right ends, read with pdfjs-dist (legacy build for Node) in a
// Node process of its own (see pdf-layout.ts). Reads the PDF from stdin and prints JSON:
// [{ height, width, lines: [{ text, top, size, left, right }] }, ...].
// Rotated text (a draft's watermark) is left out: it belongs to no line.
import { joinParts, pdfFromStdin } from './pdf-read.mjs';

const pdf = await pdfFromStdin();
const pages = [];
for (let n = 1; n <= pdf.numPages; n++) {
  const page = await pdf.getPage(n);
  const [, , width, height] = page.view;
  const { items } = await page.getTextContent();
  const lines = [];
  for (const item of items.filter((i) => i.str !== undefined && i.str.trim() !== '')) {
    const [a, b, , d, x, y] = item.transform;
    if (Math.abs(b) > 1e-6) continue;
    let line = lines.find((l) => Math.abs(l.y - y) < 1.5);
    if (!line) lines.push((line = { y, size: 0, parts: [] }));
    line.size = Math.max(line.size, Math.abs(d || a));
    line.parts.push({ x, end: x + item.width, str: item.str });
  }
  lines.sort((p, q) => q.y - p.y);
  pages.push({
    height,
    width,
    lines: lines.map((l) => {
      const left = Math.min(...l.parts.map((p) => p.x));
      const right = Math.max(...l.parts.map((p) => p.end));
      return {
        text: joinParts(l.parts), top: Math.round((height - l.y - l.size) * 10) / 10, size: Math.round(l.size * 100) / 100,
        left: Math.round(left * 10) / 10, right: Math.round(right * 10) / 10,
      };
    }),
  });
}
process.stdout.write(JSON.stringify(pages));
