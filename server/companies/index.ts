export { Company, initCompanyModel } from "./model.ts";
export { companyRoutes } from "./routes.ts";
export { placeOfCompany } from "./address.ts";
