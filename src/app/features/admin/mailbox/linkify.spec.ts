import { linkify } from './linkify';

describe('linkify', () => {
  it('turns web addresses into links and keeps the words around them', () => {
    expect(linkify('Choose a password: http://127.0.0.1:3100/set-password/abc_DEF-123 within 72 hours.')).toEqual([
      { kind: 'text', text: 'Choose a password: ' },
      { kind: 'link', text: 'http://127.0.0.1:3100/set-password/abc_DEF-123', href: 'http://127.0.0.1:3100/set-password/abc_DEF-123' },
      { kind: 'text', text: ' within 72 hours.' },
    ]);
  });

  it('leaves the full stop or bracket that ends a sentence out of the link', () => {
    const parts = linkify('(see https://example.org/a).');
    expect(parts[1]).toEqual({ kind: 'link', text: 'https://example.org/a', href: 'https://example.org/a' });
    expect(parts[2]).toEqual({ kind: 'text', text: ').' });
  });

  it('makes no link of other schemes or of markup', () => {
    expect(linkify('javascript:alert(1) <a href="x">y</a>')).toEqual([
      { kind: 'text', text: 'javascript:alert(1) <a href="x">y</a>' },
    ]);
  });

  it('handles several links and text without any', () => {
    expect(linkify('https://a.example https://b.example').filter((p) => p.kind === 'link')).toHaveLength(2);
    expect(linkify('')).toEqual([]);
  });
});
