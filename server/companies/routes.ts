import { companyAddressSchema, companyProfileDtoSchema } from "../../shared/accounts/schemas.ts";
import { createRoutes } from "../http/route.ts";
import { changeCompanyAddress, findOwnCompany } from "./address.ts";
import { canManageOwnCompany } from "./policy.ts";

export const companyRoutes = createRoutes("/api/company");

companyRoutes.get("/", { allow: canManageOwnCompany, response: companyProfileDtoSchema }, (req) =>
  findOwnCompany(req.user!),
);

companyRoutes.put(
  "/address",
  { allow: canManageOwnCompany, body: companyAddressSchema, response: companyProfileDtoSchema },
  (req, _res, { body }) => changeCompanyAddress(req.user!, body),
);
