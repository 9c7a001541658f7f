import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from "sequelize";

export class JobReview extends Model<InferAttributes<JobReview>, InferCreationAttributes<JobReview>> {
  declare id: CreationOptional<number>;
  declare workOrderId: number;
  declare technicianId: number;
  declare shopCompanyId: number;
  declare authorUserId: number;
  declare stars: number;
  declare body: string;
  declare reply: CreationOptional<string | null>;
  declare repliedBy: CreationOptional<number | null>;
  declare repliedAt: CreationOptional<Date | null>;
  declare reportedAt: CreationOptional<Date | null>;
  declare reportReason: CreationOptional<string | null>;
  declare reportedBy: CreationOptional<number | null>;
  declare selfRatingSignals: CreationOptional<string[]>;
  declare excludedAt: CreationOptional<Date | null>;
  declare excludedBy: CreationOptional<number | null>;
  declare exclusionReason: CreationOptional<string | null>;
  declare keptAt: CreationOptional<Date | null>;
  declare keptBy: CreationOptional<number | null>;
  declare createdAt: CreationOptional<Date>;
}

export function initReviewModel(sequelize: Sequelize) {
  JobReview.init(
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      workOrderId: { type: DataTypes.INTEGER, allowNull: false },
      technicianId: { type: DataTypes.INTEGER, allowNull: false },
      shopCompanyId: { type: DataTypes.INTEGER, allowNull: false },
      authorUserId: { type: DataTypes.INTEGER, allowNull: false },
      stars: { type: DataTypes.SMALLINT, allowNull: false },
      body: { type: DataTypes.TEXT, allowNull: false },
      reply: { type: DataTypes.TEXT, allowNull: true },
      repliedBy: { type: DataTypes.INTEGER, allowNull: true },
      repliedAt: { type: DataTypes.DATE, allowNull: true },
      reportedAt: { type: DataTypes.DATE, allowNull: true },
      reportReason: { type: DataTypes.TEXT, allowNull: true },
      reportedBy: { type: DataTypes.INTEGER, allowNull: true },
      selfRatingSignals: { type: DataTypes.ARRAY(DataTypes.TEXT), allowNull: false, defaultValue: [] },
      excludedAt: { type: DataTypes.DATE, allowNull: true },
      excludedBy: { type: DataTypes.INTEGER, allowNull: true },
      exclusionReason: { type: DataTypes.TEXT, allowNull: true },
      keptAt: { type: DataTypes.DATE, allowNull: true },
      keptBy: { type: DataTypes.INTEGER, allowNull: true },
      createdAt: DataTypes.DATE,
    },
    { sequelize, tableName: "job_reviews", underscored: true, updatedAt: false },
  );
}
