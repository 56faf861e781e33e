/**
 * The browser tests (`npm run test:browser`): headless Chromium (Debian's /usr/bin/chromium) driven by playwright-core
 * against the built preview (dist/). Kept apart from `npm test`, whose config excludes test/browser/**.
 */
import path from "node:path";
import { fileURLToPath } from "node:url";
import { defineConfig } from "vitest/config";

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), "../..");

export default defineConfig({
  root,
  test: {
    include: ["test/browser/**/*.test.ts"],
    setupFiles: ["test/setup.ts"],
    environment: "node",
    testTimeout: 60_000,
    hookTimeout: 120_000,
    fileParallelism: false,
  },
});
