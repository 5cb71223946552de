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
    }
  }
}

export {};
