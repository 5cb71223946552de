import type { OutgoingHttpHeaders } from 'node:http';
import type { Request, RequestHandler, Response } from 'express';
import type { Logger } from 'pino';
import { redactedValue, redactUrl, secretHeaders, secretKeys } from './log-redaction';

/** Requests that are never logged on success: the health check, asked every few seconds by monitors. */
const notLogged = new Set(['/api/health']);

const secretNames = new Set<string>([...secretKeys, ...secretHeaders]);

/** A copy of headers or query parameters with every secret value replaced (see log-redaction.ts). */
function withoutSecrets<T extends object>(values: T): T {
  const copy: Record<string, unknown> = {};
  for (const name in values) {
    copy[name] = secretNames.has(name) ? redactedValue : values[name];
  }
  return copy as T;
}

/** The query string's parameters, parsed only when the address has one. */
const queryOf = (req: Request) => (req.originalUrl.includes('?') ? withoutSecrets(req.query) : {});

type Arrival = {
  id: number;
  started: number;
  params: Request['params'];
  remoteAddress: string | undefined;
  remotePort: number | undefined;
};

/**
 * The request's line: what pino-http wrote (its request and response serializers, field by field:
 * id, method, url, query, params, headers, remote address and port; status and headers; the time
 * in ms), with secrets replaced here rather than by pino's wildcard redaction of every line.
 */
function requestLine(req: Request, res: Response, arrival: Arrival, withDatabaseTime: boolean) {
  const failed = res.statusCode >= 500;
  return {
    req: {
      id: arrival.id,
      method: req.method,
      url: redactUrl(req.originalUrl),
      query: queryOf(req),
      params: withoutSecrets(arrival.params ?? {}),
      headers: withoutSecrets(req.headers),
      remoteAddress: arrival.remoteAddress,
      remotePort: arrival.remotePort,
    },
    ...(withDatabaseTime && res.locals.databaseTime && { database: res.locals.databaseTime }),
    res: { statusCode: res.statusCode, headers: withoutSecrets<OutgoingHttpHeaders>(res.getHeaders()) },
    ...(failed && { err: new Error(`failed with status code ${res.statusCode}`) }),
    responseTime: Date.now() - arrival.started,
  };
}

const messageOf = (req: Request, res: Response) =>
  res.statusCode >= 500
    ? 'request errored'
    : !req.readableAborted && res.writableEnded
      ? 'request completed'
      : 'request aborted';

/**
 * The request log: one line per request at info level, written when the answer has gone out (or
 * the connection closed first), with the fields pino-http wrote. pino-http made a child logger per
 * request as it arrived, serialising and redacting the whole request with the 18 wildcard paths of
 * log-redaction.ts whatever was later logged, then serialised and redacted the response again at
 * the end; here the line is built once at the end from explicit fields with their secrets
 * replaced, and written by `lineLogger`, which redacts nothing more.
 *
 * req.log (warnings and errors of a request, e.g. the error handler's) is a child of `logger`
 * naming the request (id, method, redacted address), made the first time it is read. With the
 * info level off (LOG_LEVEL=warn or higher) no line is built at all.
 */
export function requestLogging(
  requestPrototype: Request,
  logger: Logger,
  lineLogger: Logger,
  options: { databaseTime: boolean },
): RequestHandler {
  const logOf = new WeakMap<Request, Logger>();
  Object.defineProperty(requestPrototype, 'log', {
    configurable: true,
    get(this: Request): Logger {
      let log = logOf.get(this);
      if (!log) {
        log = logger.child({ req: { id: this.id, method: this.method, url: redactUrl(this.originalUrl) } });
        logOf.set(this, log);
      }
      return log;
    },
    set(this: Request, log: Logger) {
      logOf.set(this, log);
    },
  });

  // Numbered in arrival order per process, as pino-http did (wrapping at 2^31 - 1).
  let lastId = 0;
  if (!lineLogger.isLevelEnabled('info')) {
    return (req, _res, next) => {
      req.id = lastId = (lastId + 1) & 0x7fffffff;
      next();
    };
  }
  return (req, res, next) => {
    const arrival: Arrival = {
      id: (lastId = (lastId + 1) & 0x7fffffff),
      started: Date.now(),
      params: req.params,
      remoteAddress: req.socket.remoteAddress,
      remotePort: req.socket.remotePort,
    };
    req.id = arrival.id;
    if (!notLogged.has(req.url)) {
      // 'close' follows 'finish' (node:_http_server, resOnFinish), and also comes when the
      // connection ends before the answer was sent.
      res.once('close', () =>
        lineLogger.info(requestLine(req, res, arrival, options.databaseTime), messageOf(req, res)),
      );
    }
    next();
  };
}
