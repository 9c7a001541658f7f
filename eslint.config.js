import js from "@eslint/js";
import tseslint from "typescript-eslint";
import reactHooks from "eslint-plugin-react-hooks";
import globals from "globals";
import path from "node:path";
import importX, { createNodeResolver } from "eslint-plugin-import-x";

// The cycle rule must follow the project's path aliases to see circles that pass through them.
const nodeResolver = createNodeResolver({ extensions: [".ts", ".tsx", ".js"] });
const aliasFolders = { "@/": "src/", "@shared/": "shared/", "@server/": "server/" };
const aliasResolver = {
  interfaceVersion: 3,
  name: "clearbench-path-aliases",
  resolve(source, file) {
    const alias = Object.keys(aliasFolders).find((prefix) => source.startsWith(prefix));
    if (!alias) return nodeResolver.resolve(source, file);
    return nodeResolver.resolve(
      path.join(import.meta.dirname, aliasFolders[alias], source.slice(alias.length)),
      file,
    );
  },
};

// A domain reaches another domain's models through server/db/models.ts: a model is a leaf, a domain's index.ts is not.
const crossDomainModel = {
  group: ["../*/model.ts", "../*/*-model.ts", "../../*/model.ts", "../../*/*-model.ts"],
  message: "Import another domain's models from server/db/models.ts (its own files use ./model.ts).",
};

export default tseslint.config(
  {
    ignores: [
      "dist/**",
      "node_modules/**",
      "uploads/**",
      ".pg/**",
      "bench/results/**",
      "tests/.screenshots/**",
    ],
  },
  js.configs.recommended,
  ...tseslint.configs.recommended,
  {
    files: ["**/*.{ts,tsx}"],
    languageOptions: { globals: { ...globals.node, ...globals.browser } },
    rules: {
      "@typescript-eslint/no-unused-vars": ["error", { argsIgnorePattern: "^_", varsIgnorePattern: "^_" }],
      "no-console": "error",
    },
  },
  {
    files: ["**/*.{ts,tsx}"],
    plugins: { "import-x": importX },
    settings: {
      "import-x/parsers": { "@typescript-eslint/parser": [".ts", ".tsx"] },
      "import-x/resolver-next": [aliasResolver],
    },
    rules: { "import-x/no-cycle": ["error", { ignoreExternal: true }] },
  },
  {
    files: ["server/**/*.ts"],
    ignores: ["server/db/**"],
    rules: { "no-restricted-imports": ["error", { patterns: [crossDomainModel] }] },
  },
  {
    files: ["jobs/**/*.ts"],
    rules: {
      "no-restricted-imports": [
        "error",
        { patterns: [{ ...crossDomainModel, group: ["**/server/*/model.ts", "**/server/*/*-model.ts"] }] },
      ],
    },
  },
  {
    files: ["src/**/*.{ts,tsx}"],
    plugins: { "react-hooks": reactHooks },
    rules: { ...reactHooks.configs.recommended.rules },
  },
  {
    // shared/ is pure: it may not reach into the client, the server or the jobs.
    files: ["shared/**/*.ts"],
    rules: {
      "no-restricted-imports": [
        "error",
        { patterns: ["**/src/**", "**/server/**", "**/jobs/**", "@/*", "@server/*"] },
      ],
    },
  },
);
