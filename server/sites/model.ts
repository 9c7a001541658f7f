import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from "sequelize";
import type { MachineTechnology } from "../../shared/technicians/schemas.ts";
import type { MachineState } from "../../shared/sites/schemas.ts";

export class Site extends Model<InferAttributes<Site>, InferCreationAttributes<Site>> {
  declare id: CreationOptional<number>;
  declare companyId: number;
  declare name: string;
  declare addressLine: string;
  declare postalCode: string;
  declare timeZone: string;
  declare latitude: number;
  declare longitude: number;
  declare contactName: CreationOptional<string | null>;
  declare contactPhone: CreationOptional<string | null>;
  declare safetyInductionNote: CreationOptional<string | null>;
  declare defaultPoNumber: CreationOptional<string | null>;
  declare defaultNotToExceedCents: CreationOptional<number | null>;
  declare active: CreationOptional<boolean>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export class Equipment extends Model<InferAttributes<Equipment>, InferCreationAttributes<Equipment>> {
  declare id: CreationOptional<number>;
  declare siteId: number;
  declare builder: string;
  declare controlFamily: string;
  declare technology: MachineTechnology;
  declare model: string;
  declare serialNumber: string | null;
  declare yearBuilt: CreationOptional<number | null>;
  declare inServiceOn: CreationOptional<string | null>;
  declare building: CreationOptional<string | null>;
  declare bay: CreationOptional<string | null>;
  declare notes: CreationOptional<string | null>;
  declare state: CreationOptional<MachineState>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export function initSiteModels(sequelize: Sequelize) {
  Site.init(
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      companyId: { type: DataTypes.INTEGER, allowNull: false },
      name: { type: DataTypes.STRING(160), allowNull: false },
      addressLine: { type: DataTypes.STRING(200), allowNull: false },
      postalCode: { type: DataTypes.STRING(10), allowNull: false },
      timeZone: { type: DataTypes.STRING(64), allowNull: false },
      latitude: { type: DataTypes.DOUBLE, allowNull: false },
      longitude: { type: DataTypes.DOUBLE, allowNull: false },
      contactName: { type: DataTypes.STRING(120), allowNull: true },
      contactPhone: { type: DataTypes.STRING(40), allowNull: true },
      safetyInductionNote: { type: DataTypes.TEXT, allowNull: true },
      defaultPoNumber: { type: DataTypes.STRING(40), allowNull: true },
      defaultNotToExceedCents: { type: DataTypes.INTEGER, allowNull: true },
      active: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { sequelize, tableName: "sites", underscored: true },
  );
  Equipment.init(
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      siteId: { type: DataTypes.INTEGER, allowNull: false },
      builder: { type: DataTypes.STRING(120), allowNull: false },
      controlFamily: { type: DataTypes.STRING(120), allowNull: false },
      technology: { type: DataTypes.STRING(40), allowNull: false },
      model: { type: DataTypes.STRING(120), allowNull: false },
      serialNumber: { type: DataTypes.STRING(80), allowNull: true },
      yearBuilt: { type: DataTypes.SMALLINT, allowNull: true },
      inServiceOn: { type: DataTypes.DATEONLY, allowNull: true },
      building: { type: DataTypes.STRING(80), allowNull: true },
      bay: { type: DataTypes.STRING(40), allowNull: true },
      notes: { type: DataTypes.TEXT, allowNull: true },
      state: { type: DataTypes.STRING(16), allowNull: false, defaultValue: "running" },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { sequelize, tableName: "equipment", underscored: true },
  );
}
