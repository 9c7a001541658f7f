import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from "sequelize";

export class Notification extends Model<
  InferAttributes<Notification>,
  InferCreationAttributes<Notification>
> {
  declare id: CreationOptional<number>;
  declare userId: number;
  declare kind: string;
  declare title: string;
  declare body: string;
  declare link: string | null;
  declare noticeId: number | null;
  declare readAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
}

export function initNoticeModels(sequelize: Sequelize) {
  Notification.init(
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      userId: { type: DataTypes.INTEGER, allowNull: false },
      kind: { type: DataTypes.STRING(40), allowNull: false },
      title: { type: DataTypes.STRING(300), allowNull: false },
      body: { type: DataTypes.TEXT, allowNull: false },
      link: { type: DataTypes.STRING(500), allowNull: true },
      noticeId: { type: DataTypes.INTEGER, allowNull: true },
      readAt: { type: DataTypes.DATE, allowNull: true },
      createdAt: DataTypes.DATE,
    },
    { sequelize, tableName: "notifications", underscored: true, updatedAt: false },
  );
}
