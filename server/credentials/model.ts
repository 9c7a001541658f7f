import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from "sequelize";
import type { CredentialValidity } from "../../shared/credentials/catalogue.ts";
import type { FieldSet } from "../../shared/credentials/credential-fields.ts";
import type { CredentialState } from "../../shared/credentials/schemas.ts";
import type { Evidence } from "../../shared/credentials/locate-values.ts";

export class CredentialType extends Model<
  InferAttributes<CredentialType>,
  InferCreationAttributes<CredentialType>
> {
  declare code: string;
  declare name: string;
  declare category: "insurance" | "safety" | "oem" | "license";
  declare holder: "company" | "technician";
  declare fieldSet: FieldSet;
  declare validity: CredentialValidity;
  declare description: string;
  declare active: CreationOptional<boolean>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export class Document extends Model<InferAttributes<Document>, InferCreationAttributes<Document>> {
  declare id: CreationOptional<number>;
  declare companyId: number;
  declare uploadedBy: number;
  declare sha256: string;
  declare sizeBytes: number;
  declare mime: string;
  declare originalName: string;
  declare extractedText: string | null;
  declare extractionMethod: string;
  /** Field evidence (confidence and page box) by credential type code, as the reader proposed it. */
  declare extractionEvidence: CreationOptional<Record<string, Evidence> | null>;
  /** Set for a file posted in a work-order thread: it belongs to that work order's parties only. */
  declare workOrderId: CreationOptional<number | null>;
  /** What a credential document was uploaded as, and for which technician (null: the company). */
  declare typeCode: CreationOptional<string | null>;
  declare technicianId: CreationOptional<number | null>;
  declare createdAt: CreationOptional<Date>;
}

export class Credential extends Model<InferAttributes<Credential>, InferCreationAttributes<Credential>> {
  declare id: CreationOptional<number>;
  declare typeCode: string;
  declare companyId: number;
  declare technicianId: number | null;
  declare documentId: number;
  declare state: CreationOptional<CredentialState>;
  declare fields: Record<string, unknown>;
  declare returnReason: CreationOptional<string | null>;
  declare submittedBy: number;
  declare submittedAt: CreationOptional<Date>;
  declare decidedBy: CreationOptional<number | null>;
  declare decidedAt: CreationOptional<Date | null>;
  declare lapsesAt: Date | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export function initCredentialModels(sequelize: Sequelize) {
  CredentialType.init(
    {
      code: { type: DataTypes.STRING(40), primaryKey: true },
      name: { type: DataTypes.STRING(160), allowNull: false },
      category: { type: DataTypes.STRING(16), allowNull: false },
      holder: { type: DataTypes.STRING(16), allowNull: false },
      fieldSet: { type: DataTypes.STRING(16), allowNull: false },
      validity: { type: DataTypes.JSONB, allowNull: false },
      description: { type: DataTypes.TEXT, allowNull: false },
      active: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { sequelize, tableName: "credential_types", underscored: true },
  );
  Document.init(
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      companyId: { type: DataTypes.INTEGER, allowNull: false },
      uploadedBy: { type: DataTypes.INTEGER, allowNull: false },
      sha256: { type: DataTypes.STRING(64), allowNull: false },
      sizeBytes: { type: DataTypes.INTEGER, allowNull: false },
      mime: { type: DataTypes.STRING(100), allowNull: false },
      originalName: { type: DataTypes.STRING(255), allowNull: false },
      extractedText: { type: DataTypes.TEXT, allowNull: true },
      extractionMethod: { type: DataTypes.STRING(12), allowNull: false },
      extractionEvidence: { type: DataTypes.JSONB, allowNull: true },
      workOrderId: { type: DataTypes.INTEGER, allowNull: true },
      typeCode: { type: DataTypes.STRING(40), allowNull: true },
      technicianId: { type: DataTypes.INTEGER, allowNull: true },
      createdAt: DataTypes.DATE,
    },
    { sequelize, tableName: "documents", underscored: true, updatedAt: false },
  );
  Credential.init(
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      typeCode: { type: DataTypes.STRING(40), allowNull: false },
      companyId: { type: DataTypes.INTEGER, allowNull: false },
      technicianId: { type: DataTypes.INTEGER, allowNull: true },
      documentId: { type: DataTypes.INTEGER, allowNull: false },
      state: { type: DataTypes.STRING(12), allowNull: false, defaultValue: "submitted" },
      fields: { type: DataTypes.JSONB, allowNull: false },
      returnReason: { type: DataTypes.TEXT, allowNull: true },
      submittedBy: { type: DataTypes.INTEGER, allowNull: false },
      submittedAt: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
      decidedBy: { type: DataTypes.INTEGER, allowNull: true },
      decidedAt: { type: DataTypes.DATE, allowNull: true },
      lapsesAt: { type: DataTypes.DATE, allowNull: true },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { sequelize, tableName: "credentials", underscored: true },
  );
}
