import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from "sequelize";
import type { Requirement } from "../../shared/standing/requirements.ts";

export class RequirementSet extends Model<
  InferAttributes<RequirementSet>,
  InferCreationAttributes<RequirementSet>
> {
  declare id: CreationOptional<number>;
  declare companyId: number;
  declare siteId: number | null;
  declare name: string;
  declare requirements: Requirement[];
  declare active: CreationOptional<boolean>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export class PlatformBaseline extends Model<
  InferAttributes<PlatformBaseline>,
  InferCreationAttributes<PlatformBaseline>
> {
  declare id: CreationOptional<number>;
  declare requirements: Requirement[];
  declare updatedBy: number | null;
  declare updatedAt: CreationOptional<Date>;
}

export class JobRun extends Model<InferAttributes<JobRun>, InferCreationAttributes<JobRun>> {
  declare id: CreationOptional<number>;
  declare job: string;
  declare asOf: Date;
  declare startedAt: Date;
  declare finishedAt: Date | null;
  declare counts: Record<string, unknown>;
  declare attempt: CreationOptional<number>;
  declare error: CreationOptional<string | null>;
  declare startedBy: CreationOptional<number | null>;
}

export function initStandingTables(sequelize: Sequelize) {
  RequirementSet.init(
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      companyId: { type: DataTypes.INTEGER, allowNull: false },
      siteId: { type: DataTypes.INTEGER, allowNull: true },
      name: { type: DataTypes.STRING(160), allowNull: false },
      requirements: { type: DataTypes.JSONB, allowNull: false },
      active: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { sequelize, tableName: "requirement_sets", underscored: true },
  );
  PlatformBaseline.init(
    {
      id: { type: DataTypes.INTEGER, primaryKey: true, defaultValue: 1 },
      requirements: { type: DataTypes.JSONB, allowNull: false },
      updatedBy: { type: DataTypes.INTEGER, allowNull: true },
      updatedAt: DataTypes.DATE,
    },
    { sequelize, tableName: "platform_baseline", underscored: true, createdAt: false },
  );
  JobRun.init(
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      job: { type: DataTypes.STRING(40), allowNull: false },
      asOf: { type: DataTypes.DATE, allowNull: false },
      startedAt: { type: DataTypes.DATE, allowNull: false },
      finishedAt: { type: DataTypes.DATE, allowNull: true },
      counts: { type: DataTypes.JSONB, allowNull: false, defaultValue: {} },
      attempt: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 1 },
      error: { type: DataTypes.TEXT, allowNull: true },
      startedBy: { type: DataTypes.INTEGER, allowNull: true },
    },
    { sequelize, tableName: "job_runs", underscored: true, timestamps: false },
  );
}
