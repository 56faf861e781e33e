#!/usr/bin/env node
/**
 * `npm run samples`: rebuilds the sample estimate workbooks in samples/ from their TypeScript description
 * (samples/scenarios.ts, built by samples/build.ts with the preview engine). Vite's module runner runs the
 * TypeScript directly, as the tests do (a server in middleware mode: no port is opened).
 */
import path from "node:path";
import { fileURLToPath } from "node:url";
import { createServer, createServerModuleRunner } from "vite";

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), "..");
process.chdir(root);
const server = await createServer({
  root,
  configFile: false,
  logLevel: "warn",
  appType: "custom",
  server: { middlewareMode: true, hmr: false, ws: false },
});
const runner = createServerModuleRunner(server.environments.ssr, { hmr: false });
let built;
try {
  const module = await runner.import("/samples/build.ts");
  built = await module.buildSamples(path.join(root, "samples"));
} finally {
  await runner.close();
  await server.close();
}
for (const b of built) {
  const verdict = b.workbook
    .cells("Estimate")
    .find((c) => typeof c.content === "string" && c.content.startsWith("=HEADROOM.VERDICT("));
  console.log(`samples/${b.spec.file}: ${verdict ? verdict.display : "(no verdict cell)"}`);
}
console.log("samples/index.json");
