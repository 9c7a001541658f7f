export { directoryRoutes } from "./routes.ts";
export { searchDirectory } from "./search.ts";
export { isListedTechnician } from "./technician-profile.ts";
