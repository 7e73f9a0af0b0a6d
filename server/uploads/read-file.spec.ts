import ExcelJS from 'exceljs';
import { parseUpload } from './parse-file';
import { SHEET_HEAD, SHEET_TAIL, sheetXml, workbookParts, writeZip, type ZipPart } from './test-workbooks';
import { Refusal } from './upload-limits';
import { InflatedText } from './zip-parts';

// The readers themselves, without a worker or a database: what a cell becomes, and what is refused.

const NS = 'http://schemas.openxmlformats.org/spreadsheetml/2006/main';
const sheet = (rows: string): ZipPart => ({ name: 'xl/worksheets/sheet1.xml', data: sheetXml(rows) });
const refusal = (p: Promise<unknown>) => p.then(() => 'accepted', (e) => (e instanceof Refusal ? e.message : `not a refusal: ${e}`));

describe('reading .xlsx', () => {
  it('reads a workbook written by exceljs through its own part readers: numbers, formulas, booleans, dates, rich text, first sheet only', async () => {
    const wb = new ExcelJS.Workbook();
    const s = wb.addWorksheet('Results');
    wb.addWorksheet('Other').addRow(['ignored', 1]);
    s.addRow(['Specimen', 'Value', 'Flag', 'Drawn', 'Note']);
    s.addRow(['S1', 5.25, true, new Date(Date.UTC(2024, 2, 7)), { richText: [{ text: 'lip' }, { text: 'aemic', font: { bold: true } }] }]);
    s.addRow([]);
    s.addRow(['  S2 ', { formula: 'B2*2', result: 10.5 }, false, new Date(Date.UTC(1999, 11, 31, 18)), { formula: 'A2&"x"', result: 'S1x' }]);
    const table = await parseUpload('pairs.xlsx', Buffer.from(await wb.xlsx.writeBuffer()));
    expect(table).toEqual({
      columns: ['Specimen', 'Value', 'Flag', 'Drawn', 'Note'],
      rows: [['S1', '5.25', 'TRUE', '2024-03-07', 'lipaemic'], ['S2', '10.5', 'FALSE', '1999-12-31', 'S1x']],
      hasHeader: true,
    });
  });

  it('reads cells without addresses, inline rich text without its phonetic guide, string and boolean formula results, and 1904 dates', async () => {
    const styles = `<styleSheet xmlns="${NS}"><numFmts count="1"><numFmt numFmtId="164" formatCode="dd/mm/yyyy"/></numFmts><cellXfs count="3"><xf numFmtId="0"/><xf numFmtId="14"/><xf numFmtId="164"/></cellXfs></styleSheet>`;
    const bytes = writeZip([...workbookParts({ styles, date1904: true }), sheet(
      '<row><c t="inlineStr"><is><t>id</t></is></c><c t="inlineStr"><is><t>x</t></is></c><c t="inlineStr"><is><t>when</t></is></c><c t="inlineStr"><is><t>note</t></is></c></row>'
      + '<row><c t="inlineStr"><is><r><t>A</t></r><r><t xml:space="preserve">-7 </t></r><rPh><t>ignored</t></rPh></is></c><c><f>1+1</f><v>2</v></c><c s="1"><v>0</v></c><c t="str"><f>"ok"</f><v>ok &amp; fine</v></c></row>'
      + '<row r="5"><c r="B5" t="b"><f>TRUE()</f><v>1</v></c><c r="C5" s="2"><v>366.5</v></c><c r="D5" s="0"><v>1e400</v></c></row>',
    )]);
    expect(await parseUpload('a.xlsx', bytes)).toEqual({
      columns: ['id', 'x', 'when', 'note'],
      rows: [['A-7', '2', '1904-01-01', 'ok & fine'], ['', 'TRUE', '1905-01-01', '1e400']],
      hasHeader: true,
    });
  });

  it('keeps characters whole where a part is cut into chunks in the middle of one', async () => {
    const labels = Array.from({ length: 3000 }, (_, i) => `µmol/L · Ä ${i} 血`);
    const shared = `<sst xmlns="${NS}"><si><t>a</t></si>${labels.map((l) => `<si><t>${l}</t></si>`).join('')}</sst>`;
    const rows = labels.map((_, i) => `<row><c t="s"><v>${i + 1}</v></c><c><v>${i}</v></c></row>`).join('');
    const table = await parseUpload('a.xlsx', writeZip([...workbookParts({ sharedStrings: true }), { name: 'xl/sharedStrings.xml', data: shared }, sheet(rows)]));
    expect(table.rows.map((r) => r[0])).toEqual(labels.slice(1));
    expect(table.columns[0]).toBe(labels[0]);
  });

  it('refuses error values, naming the sheet row and column', async () => {
    const book = (rows: string) => writeZip([...workbookParts(), sheet(rows)]);
    expect(await refusal(parseUpload('a.xlsx', book('<row><c><v>1</v></c><c><v>2</v></c></row><row r="3"><c><v>1</v></c><c r="B3" t="e"><v>#N/A</v></c></row>'))))
      .toBe('sheet row 3, column B: the cell holds the error #N/A; fix it in the workbook and upload again');
    expect(await refusal(parseUpload('a.xlsx', book('<row r="7"><c r="AB7" t="e"><f>1/0</f><v>#DIV/0!</v></c></row>'))))
      .toBe('sheet row 7, column AB: the formula gives the error #DIV/0!');
    expect(await refusal(parseUpload('a.xlsx', book('<row><c><v>1</v></c></row><row><c t="s"><v>4</v></c></row>'))))
      .toMatch(/^sheet row 2, column A: the cell refers to a shared text the workbook does not hold/);
    expect(await refusal(parseUpload('a.xlsx', writeZip([...workbookParts(), { name: 'xl/worksheets/sheet1.xml', data: `${SHEET_HEAD}<row><c><v>1</v></c></row><row><c>` }]))))
      .toMatch(/^The workbook could not be read \(its sheet, near sheet row 2, is not valid XML\)/);
    expect(await refusal(parseUpload('a.xlsx', writeZip([...workbookParts(), { name: 'xl/worksheets/sheet1.xml', data: `${SHEET_HEAD}<row><c><v>1</v></c></row><row><c></row>${SHEET_TAIL}` }]))))
      .toMatch(/^The workbook could not be read \(its sheet, near sheet row 2, is not valid XML\)/);
    expect(await refusal(parseUpload('a.xlsx', writeZip(workbookParts())))).toMatch(/^The workbook has no part xl\/worksheets\/sheet1\.xml/);
  });

  it('counts inflated bytes against the budget and stops at it, whatever the headers said', async () => {
    const budget = { left: 100 };
    const counter = new InflatedText(budget);
    const seen: string[] = [];
    counter.on('data', (s: string) => seen.push(s));
    const failed = new Promise<Error>((resolve) => counter.on('error', resolve));
    counter.write(Buffer.from('µ'.repeat(30)));
    counter.write(Buffer.from('x'.repeat(50)));
    expect((await failed).message).toMatch(/^The workbook inflates to more than 50 MB when unpacked/);
    expect(seen.join('')).toBe('µ'.repeat(30));
  });
});

describe('reading delimited text', () => {
  it('reads quoted values with delimiters, line breaks and doubled quotes, and any line ending', async () => {
    const table = await parseUpload('a.csv', Buffer.from('\uFEFFid;"x";y\r\n"B;1";"5,1";"say ""hi""\nthere"\r\n\n B2 ;7,2;\rB3;8;'));
    expect(table).toEqual({ columns: ['id', 'x', 'y'], rows: [['B;1', '5,1', 'say "hi"\nthere'], ['B2', '7,2', ''], ['B3', '8', '']], hasHeader: true });
  });

  it('refuses a quote that is never closed or is followed by other characters, naming the row', async () => {
    expect(await refusal(parseUpload('a.csv', Buffer.from('x,y\n1,2\n"3\n4,5\n')))).toBe('file row 3: a value opens a quote (") that is never closed; check the quotes in the file');
    expect(await refusal(parseUpload('a.csv', Buffer.from('x,y\n"a\nb",2\n3,"4"5\n'))))
      .toBe('file row 4, column B: a quoted value is followed by other characters before the next ","; check the quotes in the file');
  });
});
