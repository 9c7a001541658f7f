import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from "sequelize";

export class AuditEvent extends Model<InferAttributes<AuditEvent>, InferCreationAttributes<AuditEvent>> {
  declare id: CreationOptional<number>;
  declare actorUserId: number | null;
  declare action: string;
  declare subjectType: string;
  declare subjectId: number;
  declare before: unknown;
  declare after: unknown;
  declare createdAt: CreationOptional<Date>;
}

export function initAuditModel(sequelize: Sequelize) {
  AuditEvent.init(
    {
      id: { type: DataTypes.BIGINT, autoIncrement: true, primaryKey: true },
      actorUserId: { type: DataTypes.INTEGER, allowNull: true },
      action: { type: DataTypes.STRING(60), allowNull: false },
      subjectType: { type: DataTypes.STRING(40), allowNull: false },
      subjectId: { type: DataTypes.INTEGER, allowNull: false },
      before: { type: DataTypes.JSONB, allowNull: true },
      after: { type: DataTypes.JSONB, allowNull: true },
      createdAt: DataTypes.DATE,
    },
    { sequelize, tableName: "audit_events", underscored: true, updatedAt: false },
  );
}
