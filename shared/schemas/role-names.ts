/*
 * The roles and their order, without zod: the client's first screen (the frame, the policy map)
 * needs these and nothing of the schema library, which would weigh on every first load.
 * roles.ts adds the zod schema the API validates with.
 */

/** Roles within one lab, from least to most rights (docs/product.md, section 2). Admin implies reviewer. */
export const roles = ['viewer', 'researcher', 'reviewer', 'admin'] as const;
export type Role = (typeof roles)[number];

export const roleRank: Record<Role, number> = { viewer: 0, researcher: 1, reviewer: 2, admin: 3 };

/** True when `role` carries at least the rights of `needed`. The server and the client both use this. */
export function roleAtLeast(role: Role, needed: Role): boolean {
  return roleRank[role] >= roleRank[needed];
}

/** What each role may do, in our words; the client shows it beside the role picker. */
export const roleDescriptions: Record<Role, string> = {
  viewer: 'Reads everything in the lab; changes nothing.',
  researcher: 'Creates and edits own studies, uploads data, adds compounds and potentials.',
  reviewer: 'Everything a researcher does, plus approving or returning studies and curating the compound library.',
  admin: 'Everything a reviewer does, plus members, invitations and lab settings.',
};
