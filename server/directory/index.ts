export { directoryRoutes } from "./routes.ts";
export { searchDirectory } from "./search.ts";
