// Text of a PDF, page by page and line by line, read with pdfjs-dist (legacy build for Node).
// Reads the PDF from stdin and prints JSON: [[line, ...], ...]. Run as its own Node process because
// jest's CommonJS sandbox cannot load pdfjs-dist's ES modules (see pdf-text.ts).
import { joinParts, pdfFromStdin } from './pdf-read.mjs';

const pdf = await pdfFromStdin();
const pages = [];
for (let n = 1; n <= pdf.numPages; n++) {
  const page = await pdf.getPage(n);
  const { items } = await page.getTextContent();
  const lines = [];
  for (const item of items.filter((i) => i.str !== undefined && i.str !== '')) {
    const [, , , , x, y] = item.transform;
    let line = lines.find((l) => Math.abs(l.y - y) < 1.5);
    if (!line) lines.push((line = { y, parts: [] }));
    line.parts.push({ x, end: x + item.width, str: item.str });
  }
  lines.sort((a, b) => b.y - a.y);
  pages.push(lines.map((l) => joinParts(l.parts)));
}
process.stdout.write(JSON.stringify(pages));
