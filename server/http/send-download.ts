import type { Response } from 'express';

/**
 * Sends a file to download under its name. The name goes through res.attachment (the
 * content-disposition package): a plain ASCII fallback in filename= and, when the name holds
 * other characters, the exact UTF-8 name in filename*= (RFC 6266 with RFC 5987 encoding), so
 * "données μM.csv" arrives as sent and no name can break the header.
 */
export function sendDownload(res: Response, file: { fileName: string; type: string; body: Buffer | string }) {
  res.attachment(file.fileName);
  res.setHeader('X-Content-Type-Options', 'nosniff');
  res.type(file.type).send(file.body);
}
