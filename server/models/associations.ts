import type { Model, ModelStatic } from 'sequelize';

/**
 * Declares what one model belongs to, one `belongsTo` per entry of `parents` (association name →
 * target model), each foreign key named after its association as everywhere in Halflight's tables
 * (lab → labId, createdBy → createdById).
 *
 * @example belongsToEach(DecayFile, { lab: Lab, uploadedBy: User })
 */
export function belongsToEach(model: ModelStatic<Model>, parents: Record<string, ModelStatic<Model>>): void {
  for (const [as, target] of Object.entries(parents)) model.belongsTo(target, { as, foreignKey: `${as}Id` });
}
