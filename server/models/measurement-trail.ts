import { DataTypes } from 'sequelize';

/**
 * Columns every per-compound measurement carries (potentials, lifetimes, E00): where it came
 * from, free notes, the optimistic-lock version and the timestamps. Matches migration 0004.
 */
export const measurementTrailAttributes = {
  source: { type: DataTypes.TEXT, allowNull: true },
  notes: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
  version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
  createdAt: DataTypes.DATE,
  updatedAt: DataTypes.DATE,
};
