import { hasHeader, parseFlag, splitClipboard } from './paste-parser';

describe('splitClipboard', () => {
  it('splits tabs into cells and line breaks into lines, with no empty line for the final break', () => {
    expect(splitClipboard('S1\t5.2\t5.4\nS2\t6.1\t6.0\n')).toEqual([
      ['S1', '5.2', '5.4'],
      ['S2', '6.1', '6.0'],
    ]);
  });

  it('reads Windows and old Mac line ends', () => {
    expect(splitClipboard('a\tb\r\nc\td\r\n')).toEqual([['a', 'b'], ['c', 'd']]);
    expect(splitClipboard('a\rb')).toEqual([['a'], ['b']]);
  });

  it('keeps ragged lines and empty cells as they are', () => {
    expect(splitClipboard('S1\t5,2\t5,4\nS2\t6,1\n\t\t7')).toEqual([
      ['S1', '5,2', '5,4'],
      ['S2', '6,1'],
      ['', '', '7'],
    ]);
  });

  it('keeps an empty line in the middle of a block', () => {
    expect(splitClipboard('1\n\n3')).toEqual([['1'], [''], ['3']]);
  });

  it('reads quoted cells holding a line break, a tab or doubled quotes', () => {
    expect(splitClipboard('S1\t"line one\nline two"\tok\nS2\t"say ""hi"""\t"a\tb"')).toEqual([
      ['S1', 'line one\nline two', 'ok'],
      ['S2', 'say "hi"', 'a\tb'],
    ]);
  });

  it('treats a quote inside a cell as text', () => {
    expect(splitClipboard('5" pipe\tx')).toEqual([['5" pipe', 'x']]);
  });

  it('gives nothing for empty text', () => {
    expect(splitClipboard('')).toEqual([]);
  });
});

describe('hasHeader', () => {
  it('sees a header when the result cells of the first line are words', () => {
    expect(hasHeader([['Specimen', 'Current', 'New'], ['S1', '5.2', '5.4']], [1, 2])).toBe(true);
  });

  it('sees data when the first line has numeric results, with a decimal comma too', () => {
    expect(hasHeader([['S1', '5,2', '5,4'], ['S2', '6,1', '6,0']], [1, 2])).toBe(false);
  });

  it('sees data when the first line has numbers the study cannot read unambiguously ("1,234")', () => {
    expect(hasHeader([['S1', '1,234', '1.234,5'], ['S2', '6.1', '6.0']], [1, 2])).toBe(false);
  });

  it('sees data, not a header, in a first line of censored results ("<0.5"), so the row is kept and marked rather than dropped', () => {
    expect(hasHeader([['S1', '<0.5', '> 100'], ['S2', '6.1', '6.0']], [1, 2])).toBe(false);
  });

  it('does not take a first data line with one typing error for a header', () => {
    expect(hasHeader([['S1', '5,x', '5.4'], ['S2', '6.1', '6.0']], [1, 2])).toBe(false);
  });

  it('never sees a header in a single line or when no pasted cell lands on a result column', () => {
    expect(hasHeader([['Current', 'New']], [0, 1])).toBe(false);
    expect(hasHeader([['Label'], ['S1']], [])).toBe(false);
  });

  it('does not take a first line with an empty result cell for a header', () => {
    expect(hasHeader([['S1', '', 'New'], ['S2', '6.1', '6.0']], [1, 2])).toBe(false);
  });
});

describe('parseFlag', () => {
  it('reads the usual ways of writing yes', () => {
    for (const yes of ['yes', 'Y', 'TRUE', '1', 'x', ' excluded ']) expect(parseFlag(yes)).toBe(true);
  });

  it('reads anything else as no', () => {
    for (const no of ['', 'no', 'false', '0', 'maybe']) expect(parseFlag(no)).toBe(false);
  });
});
