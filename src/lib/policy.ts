import { roleAtLeast } from '@shared/schemas/role-names';
import type { Role } from '@shared/schemas/role-names';

/**
 * The least role each action needs inside one lab. It mirrors the server's checks so screens only
 * offer what the server will allow; the server stays the authority and answers 403 otherwise.
 */
export const policy = {
  'members:view': 'viewer',
  'members:manage': 'admin',
  'invitations:manage': 'admin',
  'studies:view': 'viewer',
  'studies:write': 'researcher',
  'studies:review': 'reviewer',
  'library:view': 'viewer',
  'library:add': 'researcher',
  'library:curate': 'reviewer',
  'settings:manage': 'admin',
} as const satisfies Record<string, Role>;

export type Action = keyof typeof policy;

/** True when a person with `role` (or no role: not a member) may do `action`. */
export function can(role: Role | null | undefined, action: Action): boolean {
  return role != null && roleAtLeast(role, policy[action]);
}
