import { z } from 'zod';

export const compoundRoleHints = ['photocatalyst', 'quencher', 'both'] as const;
export const compoundRoleHintSchema = z
  .enum(compoundRoleHints)
  .meta({ id: 'CompoundRoleHint', description: 'How the lab uses the compound: emitter, quencher or either' });
export type CompoundRoleHint = z.infer<typeof compoundRoleHintSchema>;
