import { Sequelize } from 'sequelize';
import pg from 'pg';

// PostgreSQL bigint (int8) and numeric arrive as strings by default; counts we read are small.
pg.types.setTypeParser(pg.types.builtins.INT8, (value) => Number(value));

export function createSequelize(databaseUrl: string): Sequelize {
  return new Sequelize(databaseUrl, {
    dialect: 'postgres',
    dialectModule: pg,
    logging: false,
    pool: { max: 10, min: 0, idle: 10_000 },
    define: { underscored: true },
  });
}
