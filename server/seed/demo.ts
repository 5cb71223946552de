import type { Sequelize } from 'sequelize';
import { Lab } from '../models';

/** The invented demo lab. Every name and number in the demo data is made up. */
export const demoLab = { name: 'Demo — Marram Photoredox Group', slug: 'demo-marram' } as const;

/**
 * Loads the invented demo scenario once, on an empty database. Later features add their
 * records here; each step checks before it inserts, so a restart never duplicates data.
 */
export async function seedDemoData(sequelize: Sequelize): Promise<{ created: boolean }> {
  return sequelize.transaction(async (transaction) => {
    const existing = await Lab.findOne({ where: { slug: demoLab.slug }, transaction });
    if (existing) return { created: false };
    await Lab.create({ ...demoLab, isDemo: true }, { transaction });
    return { created: true };
  });
}
