import { fileNameFrom } from './file-download';

describe('fileNameFrom', () => {
  it('takes the name the server gives', () => {
    expect(fileNameFrom('attachment; filename="parallax-study-7.xlsx"', 'x.xlsx')).toBe('parallax-study-7.xlsx');
  });

  it('reads an encoded UTF-8 name', () => {
    expect(fileNameFrom("attachment; filename*=UTF-8''gl%C3%BCcose.xlsx", 'x.xlsx')).toBe('glücose.xlsx');
  });

  it('falls back when there is no header or the name holds a path', () => {
    expect(fileNameFrom(null, 'archive.xlsx')).toBe('archive.xlsx');
    expect(fileNameFrom('attachment; filename="../etc/passwd"', 'archive.xlsx')).toBe('archive.xlsx');
  });
});
