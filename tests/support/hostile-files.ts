import { Readable } from 'node:stream';
import yazl from 'yazl';

/**
 * Files built to exhaust a parser: small on the wire, huge once read. Generated in the test
 * (nothing large is committed); every one is invented.
 */

/** 237 bytes of JCAMP-DX whose one run-length (DUP) line expands to 10 million points. */
export function jcampDupBomb(): Buffer {
  // ASDF (JCAMP-DX 4.24): "@" is the SQZ digit 0, "s9999999" repeats it 9,999,999 more times.
  const text = [
    '##TITLE=run-length test',
    '##JCAMP-DX=4.24',
    '##DATA TYPE=UV/VIS SPECTRUM',
    '##XUNITS=NANOMETERS',
    '##YUNITS=ARBITRARY UNITS',
    '##FIRSTX=400',
    '##LASTX=800',
    '##XFACTOR=1',
    '##YFACTOR=1',
    '##NPOINTS=10000000',
    '##XYDATA=(X++(Y..Y))',
    '400@s9999999',
    '##END=',
    '',
  ].join('\n');
  return Buffer.from(text);
}

const CONTENT_TYPES =
  '<?xml version="1.0" encoding="UTF-8"?><Types xmlns="http://schemas.openxmlformats.org/package/2006/content-types">' +
  '<Default Extension="rels" ContentType="application/vnd.openxmlformats-package.relationships+xml"/>' +
  '<Default Extension="xml" ContentType="application/xml"/>' +
  '<Override PartName="/xl/workbook.xml" ContentType="application/vnd.openxmlformats-officedocument.spreadsheetml.sheet.main+xml"/>' +
  '<Override PartName="/xl/worksheets/sheet1.xml" ContentType="application/vnd.openxmlformats-officedocument.spreadsheetml.worksheet+xml"/>' +
  '<Override PartName="/xl/sharedStrings.xml" ContentType="application/vnd.openxmlformats-officedocument.spreadsheetml.sharedStrings+xml"/>' +
  '</Types>';
const ROOT_RELS =
  '<?xml version="1.0" encoding="UTF-8"?><Relationships xmlns="http://schemas.openxmlformats.org/package/2006/relationships">' +
  '<Relationship Id="rId1" Type="http://schemas.openxmlformats.org/officeDocument/2006/relationships/officeDocument" Target="xl/workbook.xml"/>' +
  '</Relationships>';
const WORKBOOK =
  '<?xml version="1.0" encoding="UTF-8"?><workbook xmlns="http://schemas.openxmlformats.org/spreadsheetml/2006/main" ' +
  'xmlns:r="http://schemas.openxmlformats.org/officeDocument/2006/relationships"><sheets><sheet name="data" sheetId="1" r:id="rId1"/></sheets></workbook>';
const WORKBOOK_RELS =
  '<?xml version="1.0" encoding="UTF-8"?><Relationships xmlns="http://schemas.openxmlformats.org/package/2006/relationships">' +
  '<Relationship Id="rId1" Type="http://schemas.openxmlformats.org/officeDocument/2006/relationships/worksheet" Target="worksheets/sheet1.xml"/>' +
  '<Relationship Id="rId2" Type="http://schemas.openxmlformats.org/officeDocument/2006/relationships/sharedStrings" Target="sharedStrings.xml"/>' +
  '</Relationships>';

/** A worksheet whose cells all point at shared strings (t="s"), `rows` rows of `columns` cells. */
function sharedStringSheet(rows: number, columns: number, index: (row: number, column: number) => number) {
  const letters = (column: number) => String.fromCharCode(65 + column);
  let xml =
    '<?xml version="1.0" encoding="UTF-8"?><worksheet xmlns="http://schemas.openxmlformats.org/spreadsheetml/2006/main"><sheetData>';
  for (let row = 1; row <= rows; row++) {
    xml += `<row r="${row}">`;
    for (let column = 0; column < columns; column++)
      xml += `<c r="${letters(column)}${row}" t="s"><v>${index(row, column)}</v></c>`;
    xml += '</row>';
  }
  return `${xml}</sheetData></worksheet>`;
}

/** Builds an .xlsx with the given sheet and a shared-strings part streamed from `sharedStrings`. */
function workbook(sheet: string, sharedStrings: Readable): Promise<Buffer> {
  const zip = new yazl.ZipFile();
  zip.addBuffer(Buffer.from(CONTENT_TYPES), '[Content_Types].xml');
  zip.addBuffer(Buffer.from(ROOT_RELS), '_rels/.rels');
  zip.addBuffer(Buffer.from(WORKBOOK), 'xl/workbook.xml');
  zip.addBuffer(Buffer.from(WORKBOOK_RELS), 'xl/_rels/workbook.xml.rels');
  zip.addReadStream(sharedStrings, 'xl/sharedStrings.xml');
  zip.addBuffer(Buffer.from(sheet), 'xl/worksheets/sheet1.xml');
  zip.end();
  const chunks: Buffer[] = [];
  return new Promise((resolve, reject) => {
    zip.outputStream.on('data', (chunk: Buffer) => chunks.push(chunk));
    zip.outputStream.on('end', () => resolve(Buffer.concat(chunks)));
    zip.outputStream.on('error', reject);
  });
}

/**
 * An .xlsx of about 1 MB whose shared-strings part inflates to `megabytes` MB: one string of
 * repeated letters (deflate squeezes it about 1000 to 1), used by a two-row sheet.
 */
export function xlsxInflatingSharedStrings(megabytes = 510): Promise<Buffer> {
  const chunk = Buffer.alloc(1024 * 1024, 'A');
  let sent = 0;
  const parts = Readable.from(
    (function* () {
      yield Buffer.from(
        '<?xml version="1.0" encoding="UTF-8"?><sst xmlns="http://schemas.openxmlformats.org/spreadsheetml/2006/main" count="3" uniqueCount="3"><si><t>[Q] (mM)</t></si><si><t>intensity</t></si><si><t>',
      );
      while (sent++ < megabytes) yield chunk;
      yield Buffer.from('</t></si></sst>');
    })(),
  );
  return workbook(
    sharedStringSheet(2, 2, (row, column) => (row === 1 ? column : 2)),
    parts,
  );
}

/**
 * A small .xlsx whose one 100 kB shared string is used by 5,000 cells: 500 MB of cell text once
 * every reference is written out, though every part inflates to less than 1 MB.
 */
export function xlsxRepeatedSharedString(): Promise<Buffer> {
  const sst = `<?xml version="1.0" encoding="UTF-8"?><sst xmlns="http://schemas.openxmlformats.org/spreadsheetml/2006/main" count="5000" uniqueCount="1"><si><t>${'B'.repeat(100_000)}</t></si></sst>`;
  return workbook(
    sharedStringSheet(1000, 5, () => 0),
    Readable.from([Buffer.from(sst)]),
  );
}

/** One line of 19 MB: numbers and commas without a line break. */
export const singleLongLine = (megabytes = 19) => Buffer.alloc(megabytes * 1024 * 1024, '1.5,');

/** A header and `rows` rows of "0,1": 3 million rows are 12 MB, under the 20 MB upload limit. */
export function manyShortRows(rows = 3_000_000): Buffer {
  const row = Buffer.from('0,1\n');
  const header = Buffer.from('[Q] (mM),intensity\n');
  const bytes = Buffer.alloc(header.length + rows * row.length);
  header.copy(bytes);
  bytes.fill(row, header.length);
  return bytes;
}
