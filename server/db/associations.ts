import type { Sequelize } from "sequelize";
import { initCompanyModel } from "../companies/model.ts";
import { initAccountModels } from "../accounts/model.ts";
import { initMailModels } from "../mail/model.ts";
import { initAuditModel } from "../audit/model.ts";
import { initTechnicianModel } from "../technicians/model.ts";
import { initCredentialModels } from "../credentials/model.ts";
import { initBrokerModels } from "../credentials/broker-model.ts";
import { initSiteModels } from "../sites/model.ts";
import { initWorkOrderModels } from "../work-orders/model.ts";
import { initReviewModel } from "../reviews/model.ts";
import { initStandingTables } from "../standing/model.ts";
import { initNoticeModels } from "../notices/model.ts";

/** Registers every model with the connection; associations between domains live here only. */
export function initModels(sequelize: Sequelize): void {
  initCompanyModel(sequelize);
  initAccountModels(sequelize);
  initMailModels(sequelize);
  initAuditModel(sequelize);
  initTechnicianModel(sequelize);
  initCredentialModels(sequelize);
  initBrokerModels(sequelize);
  initSiteModels(sequelize);
  initWorkOrderModels(sequelize);
  initReviewModel(sequelize);
  initStandingTables(sequelize);
  initNoticeModels(sequelize);
}
