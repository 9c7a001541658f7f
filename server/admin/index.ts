export { adminJobRoutes } from "./routes.ts";
