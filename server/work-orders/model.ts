import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from "sequelize";
import type { Urgency, WorkOrderSide, WorkOrderStatus } from "../../shared/work-orders/schemas.ts";
import type { StandingSnapshot } from "../../shared/work-orders/standing-snapshot.ts";
import type { PartUsed, ProblemArea, WorkKind } from "../../shared/machines/service-history.ts";

export class WorkOrder extends Model<InferAttributes<WorkOrder>, InferCreationAttributes<WorkOrder>> {
  declare id: CreationOptional<number>;
  declare shopCompanyId: number;
  declare siteId: number;
  declare equipmentId: number | null;
  declare technicianId: number;
  declare serviceCompanyId: number;
  declare requirementSetId: number | null;
  declare technology: string;
  declare problem: string;
  declare urgency: Urgency;
  declare preferredDates: string[];
  declare siteContactName: CreationOptional<string | null>;
  declare siteContactPhone: CreationOptional<string | null>;
  declare poNumber: CreationOptional<string | null>;
  declare notToExceedCents: CreationOptional<number | null>;
  declare safetyInductionNote: CreationOptional<string | null>;
  declare status: CreationOptional<WorkOrderStatus>;
  declare declineReason: CreationOptional<string | null>;
  declare proposedDate: CreationOptional<string | null>;
  declare arrivalAt: CreationOptional<Date | null>;
  declare cancelReason: CreationOptional<string | null>;
  declare disputeReason: CreationOptional<string | null>;
  declare copiedFromId: CreationOptional<number | null>;
  // numeric columns arrive from pg as text; dto.ts turns them into numbers.
  declare hoursWorked: CreationOptional<string | null>;
  declare travelHours: CreationOptional<string | null>;
  declare completionNote: CreationOptional<string | null>;
  declare snapshotAccepted: CreationOptional<StandingSnapshot | null>;
  declare snapshotCompleted: CreationOptional<StandingSnapshot | null>;
  declare workKind: CreationOptional<WorkKind | null>;
  declare problemArea: CreationOptional<ProblemArea | null>;
  declare partsUsed: CreationOptional<PartUsed[]>;
  declare createdBy: number;
  declare acceptedAt: CreationOptional<Date | null>;
  declare declinedAt: CreationOptional<Date | null>;
  declare completedAt: CreationOptional<Date | null>;
  declare confirmedAt: CreationOptional<Date | null>;
  declare cancelledAt: CreationOptional<Date | null>;
  declare disputedAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export class WorkOrderMessage extends Model<
  InferAttributes<WorkOrderMessage>,
  InferCreationAttributes<WorkOrderMessage>
> {
  declare id: CreationOptional<number>;
  declare workOrderId: number;
  declare authorUserId: number;
  declare side: WorkOrderSide;
  declare body: string;
  declare documentId: number | null;
  declare createdAt: CreationOptional<Date>;
}

export function initWorkOrderModels(sequelize: Sequelize) {
  WorkOrder.init(
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      shopCompanyId: { type: DataTypes.INTEGER, allowNull: false },
      siteId: { type: DataTypes.INTEGER, allowNull: false },
      equipmentId: { type: DataTypes.INTEGER, allowNull: true },
      technicianId: { type: DataTypes.INTEGER, allowNull: false },
      serviceCompanyId: { type: DataTypes.INTEGER, allowNull: false },
      requirementSetId: { type: DataTypes.INTEGER, allowNull: true },
      technology: { type: DataTypes.STRING(40), allowNull: false },
      problem: { type: DataTypes.TEXT, allowNull: false },
      urgency: { type: DataTypes.STRING(8), allowNull: false },
      preferredDates: { type: DataTypes.JSONB, allowNull: false },
      siteContactName: { type: DataTypes.STRING(120), allowNull: true },
      siteContactPhone: { type: DataTypes.STRING(40), allowNull: true },
      poNumber: { type: DataTypes.STRING(40), allowNull: true },
      notToExceedCents: { type: DataTypes.INTEGER, allowNull: true },
      safetyInductionNote: { type: DataTypes.TEXT, allowNull: true },
      status: { type: DataTypes.STRING(12), allowNull: false, defaultValue: "requested" },
      declineReason: { type: DataTypes.TEXT, allowNull: true },
      proposedDate: { type: DataTypes.DATEONLY, allowNull: true },
      arrivalAt: { type: DataTypes.DATE, allowNull: true },
      cancelReason: { type: DataTypes.TEXT, allowNull: true },
      disputeReason: { type: DataTypes.TEXT, allowNull: true },
      copiedFromId: { type: DataTypes.INTEGER, allowNull: true },
      hoursWorked: { type: DataTypes.DECIMAL(6, 2), allowNull: true },
      travelHours: { type: DataTypes.DECIMAL(6, 2), allowNull: true },
      completionNote: { type: DataTypes.TEXT, allowNull: true },
      snapshotAccepted: { type: DataTypes.JSONB, allowNull: true },
      snapshotCompleted: { type: DataTypes.JSONB, allowNull: true },
      workKind: { type: DataTypes.STRING(24), allowNull: true },
      problemArea: { type: DataTypes.STRING(24), allowNull: true },
      partsUsed: { type: DataTypes.JSONB, allowNull: false, defaultValue: [] },
      createdBy: { type: DataTypes.INTEGER, allowNull: false },
      acceptedAt: { type: DataTypes.DATE, allowNull: true },
      declinedAt: { type: DataTypes.DATE, allowNull: true },
      completedAt: { type: DataTypes.DATE, allowNull: true },
      confirmedAt: { type: DataTypes.DATE, allowNull: true },
      cancelledAt: { type: DataTypes.DATE, allowNull: true },
      disputedAt: { type: DataTypes.DATE, allowNull: true },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { sequelize, tableName: "work_orders", underscored: true },
  );
  WorkOrderMessage.init(
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      workOrderId: { type: DataTypes.INTEGER, allowNull: false },
      authorUserId: { type: DataTypes.INTEGER, allowNull: false },
      side: { type: DataTypes.STRING(8), allowNull: false },
      body: { type: DataTypes.TEXT, allowNull: false },
      documentId: { type: DataTypes.INTEGER, allowNull: true },
      createdAt: DataTypes.DATE,
    },
    { sequelize, tableName: "work_order_messages", underscored: true, updatedAt: false },
  );
}
