// What pdf-text.mjs and pdf-layout.mjs share: the PDF read from stdin with pdfjs-dist (legacy build for Node),
// and a line's pieces of text joined left to right, with a space where a gap lies between them.
import { getDocument } from 'pdfjs-dist/legacy/build/pdf.mjs';

/** The PDF on stdin, opened. */
export async function pdfFromStdin() {
  const chunks = [];
  for await (const chunk of process.stdin) chunks.push(chunk);
  return getDocument({ data: new Uint8Array(Buffer.concat(chunks)), verbosity: 0, isEvalSupported: false }).promise;
}

/** A line's pieces ({ x, end, str }) sorted by x and joined, one space where they do not touch. */
export function joinParts(parts) {
  parts.sort((p, q) => p.x - q.x);
  let text = '';
  let end = -Infinity;
  for (const p of parts) {
    text += (text && p.x - end > 1 ? ' ' : '') + p.str;
    end = p.end;
  }
  return text.replace(/\s+/g, ' ').trim();
}
