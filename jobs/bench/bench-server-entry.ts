import { loadConfig } from "../../server/config.ts";
import { startServer } from "../../server/main.ts";

// server/serve.ts with one difference: the built client comes from the bench's own build folder (CLIENT_DIR), so the
// bench never overwrites dist/ while others work in the tree.
const running = await startServer(loadConfig(), { clientDir: process.env.CLIENT_DIR });
const stop = async () => {
  await running.close().catch(() => undefined);
  process.exit(0);
};
process.on("SIGINT", () => void stop());
process.on("SIGTERM", () => void stop());
