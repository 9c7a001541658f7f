export { siteRoutes, postalCodeRoutes } from "./routes.ts";
export { Site, Equipment, initSiteModels } from "./model.ts";
export { isOwnSite } from "./policy.ts";
export { findShopEquipment } from "./service.ts";
