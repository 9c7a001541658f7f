import type { Sequelize } from "sequelize";
import { initCompanyModel } from "../companies/model.ts";
import { initAccountModels } from "../accounts/model.ts";
import { initMailModels } from "../mail/model.ts";
import { initAuditModel } from "../audit/model.ts";
import { initTechnicianModel } from "../technicians/model.ts";
import { initCredentialModels } from "../credentials/model.ts";

/** Registers every model with the connection; associations between domains live here only. */
export function initModels(sequelize: Sequelize): void {
  initCompanyModel(sequelize);
  initAccountModels(sequelize);
  initMailModels(sequelize);
  initAuditModel(sequelize);
  initTechnicianModel(sequelize);
  initCredentialModels(sequelize);
}
