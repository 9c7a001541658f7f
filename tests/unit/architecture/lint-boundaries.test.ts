import path from "node:path";
import { ESLint } from "eslint";
import { describe, expect, it } from "vitest";

// The boundaries live in eslint.config.js; these checks feed it a deliberate breach and expect `npm run lint` to fail.
const root = path.resolve(import.meta.dirname, "../../..");
const eslint = new ESLint({ cwd: root });

async function rulesBroken(code: string, file: string): Promise<string[]> {
  const [result] = await eslint.lintText(code, { filePath: path.join(root, file) });
  return result!.messages.filter((m) => m.severity === 2).map((m) => m.ruleId ?? "parse");
}

describe("lint boundaries", () => {
  it("refuses an import circle: the SQL helpers may not reach back into a domain that uses them", async () => {
    const code =
      'import { refreshStandings } from "../standing/index.ts";\nexport const again = refreshStandings;\n';
    expect(await rulesBroken(code, "server/db/sql.ts")).toContain("import-x/no-cycle");
  }, 60_000);

  it("refuses a domain importing another domain's model file", async () => {
    const code = 'import { Company } from "../companies/model.ts";\nexport const owner = Company;\n';
    expect(await rulesBroken(code, "server/credentials/probe.ts")).toContain("no-restricted-imports");
  }, 60_000);

  it("lets a domain reach other models through server/db/models.ts and its own through ./model.ts", async () => {
    const code =
      'import { Company } from "../db/models.ts";\nimport { Credential } from "./model.ts";\n' +
      "export const both = [Company, Credential];\n";
    expect(await rulesBroken(code, "server/credentials/probe.ts")).toEqual([]);
  }, 60_000);
});
