/** A piece of e-mail text: plain words, or a web address to show as a link. */
export type TextPart = { kind: 'text'; text: string } | { kind: 'link'; text: string; href: string };

const URL_PATTERN = /https?:\/\/[^\s<>"']+/g;
/** Punctuation that ends a sentence rather than the address. */
const TRAILING = /[.,;:!?)\]]+$/;

/**
 * Splits text into plain parts and http(s) links, so a template can render both as nodes
 * (text interpolation and <a [href]>) without ever building HTML from the text.
 */
export function linkify(text: string): TextPart[] {
  const parts: TextPart[] = [];
  let at = 0;
  for (const match of text.matchAll(URL_PATTERN)) {
    const start = match.index ?? 0;
    const url = match[0].replace(TRAILING, '');
    if (start > at) parts.push({ kind: 'text', text: text.slice(at, start) });
    parts.push({ kind: 'link', text: url, href: url });
    at = start + url.length;
  }
  if (at < text.length) parts.push({ kind: 'text', text: text.slice(at) });
  return parts;
}
