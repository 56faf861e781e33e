/**
 * `npm run lint`: ESLint's recommended rules and typescript-eslint's recommended rules over the repository's own
 * code. Import circles in src/ are found by test/imports.test.ts instead of a lint rule: it counts type-only imports,
 * which ESLint's import plugins skip.
 *
 * A rule switched off here says why, beside it.
 */
import js from "@eslint/js";
import { defineConfig } from "eslint/config";
import globals from "globals";
import tseslint from "typescript-eslint";

export default defineConfig(
  { ignores: ["dist/", "dist-tsc/", "coverage/", "test-results/"] },
  js.configs.recommended,
  tseslint.configs.recommended,
  {
    // Build scripts, the dev-server helpers and the icon script run in Node.
    files: ["**/*.{js,mjs,cjs}"],
    languageOptions: { globals: globals.node },
  },
  {
    files: ["src/functions/{supply,demand,piping,decision,pump,units}.ts"],
    rules: {
      // Every cell-function parameter is typed `any` on purpose (DEVELOPERS.md, "Rules of the house"): Excel passes
      // whatever the cell holds, and args.ts decides what it means. A narrower type would be a promise Excel breaks.
      "@typescript-eslint/no-explicit-any": "off",
    },
  },
);
