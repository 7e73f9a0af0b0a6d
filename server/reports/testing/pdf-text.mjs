// Text of a PDF, page by page and line by line, read with pdfjs-dist (legacy build for Node).
// Reads the PDF from stdin and prints JSON: [[line, ...], ...]. Run as its own Node process because
// jest's CommonJS sandbox cannot load pdfjs-dist's ES modules (see pdf-text.ts).
import { getDocument } from 'pdfjs-dist/legacy/build/pdf.mjs';

const chunks = [];
for await (const chunk of process.stdin) chunks.push(chunk);
const pdf = await getDocument({ data: new Uint8Array(Buffer.concat(chunks)), verbosity: 0, isEvalSupported: false }).promise;
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
  pages.push(lines.map((l) => {
    l.parts.sort((a, b) => a.x - b.x);
    let text = '';
    let end = -Infinity;
    for (const p of l.parts) {
      text += (text && p.x - end > 1 ? ' ' : '') + p.str;
      end = p.end;
    }
    return text.replace(/\s+/g, ' ').trim();
  }));
}
process.stdout.write(JSON.stringify(pages));
