import type { Role } from '@shared/schemas/roles';

/**
 * The lab a request acts in, with the caller's role there. The access guard builds it from the
 * membership (server/middleware/access.ts); services take it as their first argument so they never
 * look at the request themselves.
 */
export interface LabContext {
  id: string;
  name: string;
  isDemo: boolean;
  role: Role;
  membershipId: string;
}
