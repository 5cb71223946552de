import { roles } from '@shared/schemas/role-names';
import type { Role } from '@shared/schemas/role-names';

/** How roles are named on screen. */
export const roleLabels: Record<Role, string> = {
  viewer: 'Viewer',
  researcher: 'Researcher',
  reviewer: 'Reviewer',
  admin: 'Admin',
};

/** Most rights first, the order people scan for when choosing. */
export const roleOptions = [...roles].reverse().map((role) => ({ value: role, label: roleLabels[role] }));
