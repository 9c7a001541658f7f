export { authRoutes, adminUserRoutes } from "./routes.ts";
export { User, initAccountModels } from "./model.ts";
export { hashPassword, setHashConcurrency, setPasswordCost } from "./passwords.ts";
export { createInvitedUser } from "./service.ts";
