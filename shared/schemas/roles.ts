import { z } from 'zod';
import { roles } from './role-names';

export { roleAtLeast, roleDescriptions, roleRank, roles } from './role-names';
export type { Role } from './role-names';

export const roleSchema = z.enum(roles).meta({ id: 'Role', description: "A person's role in one lab" });
