export { Company, initCompanyModel } from "./model.ts";
