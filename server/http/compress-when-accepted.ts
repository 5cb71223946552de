import type { RequestHandler, Response } from 'express';
import compression from 'compression';

const noTransform = /(?:^|,)\s*?no-transform\s*?(?:,|$)/i;

/**
 * `compress` (the compression middleware) for requests that name an Accept-Encoding. For one that
 * names none, compression (1.8, index.js) answers unencoded ("identity") and its only mark on the
 * answer is `Vary: Accept-Encoding` when the type is compressible and the Cache-Control allows a
 * transform; yet it still wraps res.write, res.end, res.on and writeHead (on-headers) and listens
 * for the close of every such request. Here only that Vary is set, by its own rule, as the
 * headers go out.
 */
export function compressWhenAccepted(compress: RequestHandler): RequestHandler {
  return (req, res, next) => {
    if (req.headers['accept-encoding'] !== undefined) {
      compress(req, res, next);
      return;
    }
    const writeHead = res.writeHead;
    res.writeHead = function (this: Response, ...args: unknown[]) {
      const cacheControl = res.getHeader('Cache-Control');
      if (compression.filter(req, res) && !(typeof cacheControl === 'string' && noTransform.test(cacheControl))) {
        // express's res.vary adds the field once, and leaves a Vary of * alone.
        res.vary('Accept-Encoding');
      }
      return (writeHead as (...all: unknown[]) => Response).apply(this, args);
    } as Response['writeHead'];
    next();
  };
}
