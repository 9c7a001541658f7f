import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from "sequelize";
import type { BrokerRequestOrigin, HolderRole } from "../../shared/credentials/broker-schemas.ts";

export class BrokerContact extends Model<
  InferAttributes<BrokerContact>,
  InferCreationAttributes<BrokerContact>
> {
  declare id: CreationOptional<number>;
  declare companyId: number;
  declare typeCode: string | null;
  declare agency: string;
  declare contactName: string;
  declare email: string;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export class BrokerUploadRequest extends Model<
  InferAttributes<BrokerUploadRequest>,
  InferCreationAttributes<BrokerUploadRequest>
> {
  declare id: CreationOptional<number>;
  declare companyId: number;
  declare typeCode: string;
  declare credentialId: number | null;
  declare shopCompanyId: number | null;
  declare agency: string;
  declare contactName: string;
  declare brokerEmail: string;
  declare tokenSha256: string;
  declare expiresAt: Date;
  declare usedAt: CreationOptional<Date | null>;
  declare documentId: CreationOptional<number | null>;
  declare shopToldAt: CreationOptional<Date | null>;
  declare requestedBy: number;
  declare holderRole: CreationOptional<HolderRole>;
  declare origin: CreationOptional<BrokerRequestOrigin>;
  declare createdAt: CreationOptional<Date>;
}

export class BrokerRequestReminder extends Model<
  InferAttributes<BrokerRequestReminder>,
  InferCreationAttributes<BrokerRequestReminder>
> {
  declare id: CreationOptional<number>;
  declare requestId: number;
  declare daysBefore: number;
  declare sentAt: CreationOptional<Date>;
}

export function initBrokerModels(sequelize: Sequelize) {
  BrokerContact.init(
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      companyId: { type: DataTypes.INTEGER, allowNull: false },
      typeCode: { type: DataTypes.STRING(40), allowNull: true },
      agency: { type: DataTypes.STRING(160), allowNull: false },
      contactName: { type: DataTypes.STRING(160), allowNull: false },
      email: { type: DataTypes.STRING(254), allowNull: false },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { sequelize, tableName: "broker_contacts", underscored: true },
  );
  BrokerUploadRequest.init(
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      companyId: { type: DataTypes.INTEGER, allowNull: false },
      typeCode: { type: DataTypes.STRING(40), allowNull: false },
      credentialId: { type: DataTypes.INTEGER, allowNull: true },
      shopCompanyId: { type: DataTypes.INTEGER, allowNull: true },
      agency: { type: DataTypes.STRING(160), allowNull: false },
      contactName: { type: DataTypes.STRING(160), allowNull: false },
      brokerEmail: { type: DataTypes.STRING(254), allowNull: false },
      tokenSha256: { type: DataTypes.CHAR(64), allowNull: false },
      expiresAt: { type: DataTypes.DATE, allowNull: false },
      usedAt: { type: DataTypes.DATE, allowNull: true },
      documentId: { type: DataTypes.INTEGER, allowNull: true },
      shopToldAt: { type: DataTypes.DATE, allowNull: true },
      requestedBy: { type: DataTypes.INTEGER, allowNull: false },
      holderRole: { type: DataTypes.STRING(24), allowNull: false, defaultValue: "certificate_holder" },
      origin: { type: DataTypes.STRING(16), allowNull: false, defaultValue: "office" },
      createdAt: DataTypes.DATE,
    },
    { sequelize, tableName: "broker_upload_requests", underscored: true, updatedAt: false },
  );
  BrokerRequestReminder.init(
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      requestId: { type: DataTypes.INTEGER, allowNull: false },
      daysBefore: { type: DataTypes.INTEGER, allowNull: false },
      sentAt: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
    },
    { sequelize, tableName: "broker_request_reminders", underscored: true, timestamps: false },
  );
}
