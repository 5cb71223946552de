import { DataTypes, Model } from 'sequelize';
import type { CreationOptional, InferAttributes, InferCreationAttributes, Sequelize } from 'sequelize';

/** One line of the append-only audit log (a database trigger refuses updates and deletes). */
export class AuditEvent extends Model<InferAttributes<AuditEvent>, InferCreationAttributes<AuditEvent>> {
  declare id: CreationOptional<number>;
  declare labId: string | null;
  declare actorId: string | null;
  declare action: string;
  declare targetType: string | null;
  declare targetId: string | null;
  declare details: Record<string, unknown>;
  declare ipAddress: string | null;
  declare createdAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize): void {
    AuditEvent.init(
      {
        id: { type: DataTypes.BIGINT, primaryKey: true, autoIncrement: true },
        labId: { type: DataTypes.UUID, allowNull: true },
        actorId: { type: DataTypes.UUID, allowNull: true },
        action: { type: DataTypes.STRING(60), allowNull: false },
        targetType: { type: DataTypes.STRING(40), allowNull: true },
        targetId: { type: DataTypes.STRING(80), allowNull: true },
        details: { type: DataTypes.JSONB, allowNull: false, defaultValue: {} },
        ipAddress: { type: DataTypes.STRING(64), allowNull: true },
        createdAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'audit_events', updatedAt: false },
    );
  }
}
