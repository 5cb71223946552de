import type { AppServices } from '../app';

declare global {
  namespace Express {
    interface Locals {
      services: AppServices;
      openApiDocument: unknown;
    }
  }
}

export {};
