import { DataTypes, QueryTypes, type Model, type ModelStatic, type Sequelize, type Transaction } from 'sequelize';

type AnyModel = ModelStatic<Model>;
/** Model.runHooks: public in Sequelize's documentation, missing from its typings. */
const runHooks = (model: AnyModel, kind: 'beforeCreate' | 'beforeUpdate', row: Model, transaction?: Transaction) =>
  (model as unknown as { runHooks(kind: string, ...args: unknown[]): Promise<void> }).runHooks(kind, row, {
    transaction,
  });

/**
 * Several changes of one request sent to PostgreSQL as one statement: each but the last a
 * data-modifying WITH part. A statement commits or fails as a whole, so rows that belong together
 * need no BEGIN and COMMIT round trips around them, and a row lock one of them takes (a
 * trigger's) is held only while PostgreSQL runs it, never across a round trip to this process.
 * Inside a transaction it saves the round trips between the parts. All parts see the database as
 * it was before the statement (a DELETE part does not see the rows an INSERT part adds).
 *
 * Rows are model instances, built and not saved: every attribute with a value is written under
 * its column, the timestamps Sequelize would set are set, JSON columns go in as JSON text
 * (node-postgres would write a JS array as a PostgreSQL array). Of the model's hooks only
 * beforeCreate and beforeUpdate run (the demo clock, server/seed/demo-clock.ts, stamps with them);
 * call validate() first where allowNull or validators matter.
 */
export class OneStatement {
  private readonly bind: unknown[] = [];
  private readonly parts: string[] = [];
  private readonly now = new Date();

  constructor(private readonly transaction?: Transaction) {}

  /** A value as a bind parameter ($n) for a part written by hand. */
  param(value: unknown): string {
    this.bind.push(value);
    return `$${this.bind.length}`;
  }

  /** A part written by hand (values through param()). */
  sql(text: string): this {
    this.parts.push(text);
    return this;
  }

  private value(model: AnyModel, key: string, value: unknown): string {
    const { type } = model.getAttributes()[key]!;
    const json = type instanceof DataTypes.JSON || type instanceof DataTypes.JSONB;
    return this.param(json && value !== null && value !== undefined ? JSON.stringify(value) : value);
  }

  private timestamps(model: AnyModel): string[] {
    if (model.options.timestamps === false) return [];
    return [model.options.createdAt === false ? '' : 'createdAt', model.options.updatedAt === false ? '' : 'updatedAt'];
  }

  /** INSERT of new rows of one model, in their order. */
  async insert(model: AnyModel, rows: Model[]): Promise<this> {
    if (rows.length === 0) return this;
    const attributes = model.getAttributes();
    const stamped = new Set(this.timestamps(model));
    for (const row of rows) {
      // As save() would: the timestamps on the instance too, then the hooks (which may set them again).
      for (const key of stamped) if (key && row.get(key) === undefined) row.set(key as never, this.now as never);
      await runHooks(model, 'beforeCreate', row, this.transaction);
    }
    const values = rows.map((row) => row.get({ plain: true }) as Record<string, unknown>);
    const keys = Object.keys(attributes).filter((key) =>
      values.some(
        (row) => stamped.has(key) || (row[key] !== undefined && !(row[key] === null && attributes[key]!.autoIncrement)),
      ),
    );
    const tuples = values.map((row) => {
      const params = keys.map((key) => {
        const value = row[key] === undefined && stamped.has(key) ? this.now : row[key];
        return value === undefined ? 'DEFAULT' : this.value(model, key, value);
      });
      return `(${params.join(', ')})`;
    });
    const columns = keys.map((key) => `"${attributes[key]!.field ?? key}"`);
    return this.sql(`INSERT INTO "${model.tableName}" (${columns.join(', ')}) VALUES ${tuples.join(', ')}`);
  }

  /** UPDATE of one row by its key: the attributes `changes` sets (and updatedAt), also set on the instance. */
  async update(model: AnyModel, row: Model, changes: Record<string, unknown>): Promise<this> {
    row.set(changes);
    // raw: set() leaves an existing row's timestamps alone otherwise (Sequelize keeps them read-only
    // there), and the UPDATE would write the old time back.
    if (this.timestamps(model).includes('updatedAt')) row.set('updatedAt' as never, this.now as never, { raw: true });
    await runHooks(model, 'beforeUpdate', row, this.transaction);
    const attributes = model.getAttributes();
    const changed = [...new Set([...Object.keys(changes), ...this.timestamps(model).filter((k) => k === 'updatedAt')])];
    const values = row.get({ plain: true }) as Record<string, unknown>;
    const sets = changed.map((key) => `"${attributes[key]!.field ?? key}" = ${this.value(model, key, values[key])}`);
    const key = model.primaryKeyAttribute;
    return this.sql(
      `UPDATE "${model.tableName}" SET ${sets.join(', ')} WHERE "${attributes[key]!.field ?? key}" = ${this.param(values[key])}`,
    );
  }

  /** The statement's text (for tests) and its binds. */
  statement(): { sql: string; bind: unknown[] } {
    const parts = [...this.parts];
    const last = parts.pop();
    if (last === undefined) throw new Error('OneStatement has nothing to write.');
    const withParts = parts.map((part, i) => `w${i} AS (${part})`);
    return { sql: withParts.length ? `WITH ${withParts.join(', ')} ${last}` : last, bind: [...this.bind] };
  }

  /** Sends the statement (in the transaction given, if any). */
  async run(sequelize: Sequelize): Promise<void> {
    const { sql, bind } = this.statement();
    await sequelize.query(sql, { bind, transaction: this.transaction, type: QueryTypes.RAW });
  }
}
