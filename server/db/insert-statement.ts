import { DataTypes, type Model, type ModelStatic } from 'sequelize';

/**
 * The INSERT of one built (unsaved) model row as plain SQL, its values appended to `binds` as $n:
 * so that several rows of one change can go to PostgreSQL as one statement (data-modifying WITH
 * parts), atomic without BEGIN and COMMIT round trips (writeInOneStatement). Every attribute with
 * a value is written under its column name; the timestamps Sequelize would set are set to `now`;
 * an attribute left undefined, or an auto-increment key left null, takes the column's default. JSON columns go
 * in as JSON text (node-postgres would write a JS array as a PostgreSQL array). Nothing here runs
 * the model's hooks: only for models that have none (validate() first for allowNull and validators).
 */
export function insertStatement(model: ModelStatic<Model>, row: Model, binds: unknown[], now: Date): string {
  const values = row.get({ plain: true }) as Record<string, unknown>;
  const timestamps = new Set(
    model.options.timestamps === false
      ? []
      : [
          model.options.createdAt === false ? null : 'createdAt',
          model.options.updatedAt === false ? null : 'updatedAt',
        ],
  );
  const columns: string[] = [];
  const params: string[] = [];
  for (const [key, attribute] of Object.entries(model.getAttributes())) {
    let value = values[key];
    if (value === undefined && timestamps.has(key)) value = now;
    if (value === undefined || (value === null && attribute.autoIncrement)) continue;
    const json = attribute.type instanceof DataTypes.JSON || attribute.type instanceof DataTypes.JSONB;
    binds.push(json && value !== null ? JSON.stringify(value) : value);
    columns.push(`"${attribute.field ?? key}"`);
    params.push(`$${binds.length}`);
  }
  return `INSERT INTO "${model.tableName}" (${columns.join(', ')}) VALUES (${params.join(', ')})`;
}

/**
 * One statement that inserts every row given (in order: each but the last as a WITH part), with
 * its binds. A single statement commits or fails as a whole, so the rows need no transaction, and
 * a row lock one of them takes (a trigger's) is held only while PostgreSQL runs it, never across
 * a round trip to this process.
 */
export function insertsInOneStatement(rows: Array<[ModelStatic<Model>, Model]>): { sql: string; bind: unknown[] } {
  const bind: unknown[] = [];
  const now = new Date();
  const inserts = rows.map(([model, row]) => insertStatement(model, row, bind, now));
  const last = inserts.pop();
  if (last === undefined) throw new Error('insertsInOneStatement needs at least one row.');
  const parts = inserts.map((insert, i) => `w${i} AS (${insert})`);
  return { sql: parts.length ? `WITH ${parts.join(', ')} ${last}` : last, bind };
}
