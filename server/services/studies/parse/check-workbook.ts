import yauzl from 'yauzl';
import { ParseProblem } from './parse-problem';
import { limitMessage, UploadLimitExceeded, type UploadLimits } from './upload-limits';

const unreadable = () => new ParseProblem('The file is not a readable .xlsx workbook.');

/** The limit of one part of the package, with its message, by the part's name. */
function partLimit(name: string, limits: UploadLimits): [number, () => UploadLimitExceeded] {
  if (name === 'xl/sharedStrings.xml')
    return [
      limits.sharedStringBytes,
      () => new UploadLimitExceeded('sharedStringBytes', limitMessage.sharedStringBytes(limits)),
    ];
  if (/^xl\/worksheets\/[^/]+\.xml$/.test(name))
    return [limits.sheetBytes, () => new UploadLimitExceeded('sheetBytes', limitMessage.sheetBytes(limits, name))];
  return [limits.inflatedBytes, () => new UploadLimitExceeded('inflatedBytes', limitMessage.inflatedBytes(limits))];
}

/**
 * Unpacks every part of an .xlsx package once, counting the bytes as they come out of the
 * decompressor and stopping at the first part (or the running total) over its limit: a 1 MB
 * workbook can hold a shared-strings part of 500 MB. The sizes the package declares are
 * checked first; yauzl also refuses a part that unpacks to more than it declares. Nothing is
 * kept: exceljs reads the package afterwards, knowing it fits.
 */
export async function checkWorkbookParts(bytes: Buffer, limits: UploadLimits): Promise<void> {
  const zip = await new Promise<yauzl.ZipFile>((resolve, reject) =>
    yauzl.fromBuffer(bytes, { lazyEntries: true, validateEntrySizes: true }, (error, opened) =>
      error || !opened ? reject(unreadable()) : resolve(opened),
    ),
  );
  let total = 0;
  const overTotal = () => new UploadLimitExceeded('inflatedBytes', limitMessage.inflatedBytes(limits));
  try {
    await new Promise<void>((resolve, reject) => {
      zip.on('error', () => reject(unreadable()));
      zip.on('end', resolve);
      zip.on('entry', (entry: yauzl.Entry) => {
        if (entry.fileName.endsWith('/')) return zip.readEntry();
        const [limit, over] = partLimit(entry.fileName, limits);
        if (entry.uncompressedSize > limit) return reject(over());
        if (total + entry.uncompressedSize > limits.inflatedBytes) return reject(overTotal());
        zip.openReadStream(entry, (error, stream) => {
          if (error || !stream) return reject(unreadable());
          let part = 0;
          stream.on('data', (chunk: Buffer) => {
            part += chunk.length;
            total += chunk.length;
            if (part > limit || total > limits.inflatedBytes) {
              stream.destroy();
              reject(part > limit ? over() : overTotal());
            }
          });
          stream.on('error', () => reject(unreadable()));
          stream.on('end', () => zip.readEntry());
        });
      });
      zip.readEntry();
    });
  } finally {
    zip.close();
  }
}
