import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from "sequelize";
import type { CompanyKind } from "../../shared/accounts/schemas.ts";

export class Company extends Model<InferAttributes<Company>, InferCreationAttributes<Company>> {
  declare id: CreationOptional<number>;
  declare name: string;
  declare kind: CompanyKind;
  declare addressLine: string | null;
  declare postalCode: string | null;
  declare timeZone: string;
  declare latitude: number | null;
  declare longitude: number | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export function initCompanyModel(sequelize: Sequelize) {
  Company.init(
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      name: { type: DataTypes.STRING(160), allowNull: false },
      kind: { type: DataTypes.STRING(16), allowNull: false },
      addressLine: { type: DataTypes.STRING(200), allowNull: true },
      postalCode: { type: DataTypes.STRING(10), allowNull: true },
      timeZone: { type: DataTypes.STRING(64), allowNull: false },
      latitude: { type: DataTypes.DOUBLE, allowNull: true },
      longitude: { type: DataTypes.DOUBLE, allowNull: true },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { sequelize, tableName: "companies", underscored: true },
  );
}
