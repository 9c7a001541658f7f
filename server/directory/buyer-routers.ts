import { postalCodeRoutes, siteRoutes } from "../sites/index.ts";
import { rosterRoutes } from "../roster/index.ts";
import { directoryRoutes } from "./routes.ts";

/** The buyer-facing routers (sites, postal codes, directory, roster), mounted together by the app. */
export const buyerRouters = [siteRoutes, postalCodeRoutes, directoryRoutes, rosterRoutes];
