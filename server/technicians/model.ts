import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from "sequelize";

export class Technician extends Model<InferAttributes<Technician>, InferCreationAttributes<Technician>> {
  declare id: CreationOptional<number>;
  declare companyId: number;
  declare name: string;
  declare email: string | null;
  declare phone: string | null;
  declare technologies: string[];
  declare controlFamilies: string[];
  declare postalCode: string;
  declare latitude: number | null;
  declare longitude: number | null;
  declare serviceRadiusKm: number;
  declare hourlyRateCents: number;
  declare travelRateCents: number;
  declare mileageRateCents: CreationOptional<number>;
  declare active: CreationOptional<boolean>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export function initTechnicianModel(sequelize: Sequelize) {
  Technician.init(
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      companyId: { type: DataTypes.INTEGER, allowNull: false },
      name: { type: DataTypes.STRING(160), allowNull: false },
      email: { type: DataTypes.STRING(254), allowNull: true },
      phone: { type: DataTypes.STRING(40), allowNull: true },
      technologies: { type: DataTypes.ARRAY(DataTypes.STRING(40)), allowNull: false, defaultValue: [] },
      controlFamilies: { type: DataTypes.ARRAY(DataTypes.STRING(80)), allowNull: false, defaultValue: [] },
      postalCode: { type: DataTypes.STRING(10), allowNull: false },
      latitude: { type: DataTypes.DOUBLE, allowNull: true },
      longitude: { type: DataTypes.DOUBLE, allowNull: true },
      serviceRadiusKm: { type: DataTypes.INTEGER, allowNull: false },
      hourlyRateCents: { type: DataTypes.INTEGER, allowNull: false },
      travelRateCents: { type: DataTypes.INTEGER, allowNull: false },
      mileageRateCents: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 73 },
      active: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { sequelize, tableName: "technicians", underscored: true },
  );
}
