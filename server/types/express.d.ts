import type { Logger } from 'pino';
import type { AppServices } from '../app';
import type { LabContext } from '../domain/lab-context';

declare global {
  namespace Express {
    interface Locals {
      services: AppServices;
      openApiDocument: unknown;
    }
    /** What passport keeps of the signed-in person: only the id. */
    interface User {
      id: string;
    }
    interface Request {
      /** Set by requireLabRole on routes under /api/labs/:labId. */
      lab?: LabContext;
      /** This process's number for the request, in arrival order (server/http/request-log.ts). */
      id?: number;
      /** Logs naming this request (id, method, redacted address); see requestLogging. */
      log: Logger;
    }
  }
}

export {};
