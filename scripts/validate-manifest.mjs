#!/usr/bin/env node
/**
 * npm run validate [-- --dist dist]: checks manifest.xml offline (see ./manifest-check.mjs for what is checked).
 *
 *   node scripts/validate-manifest.mjs [manifest.xml] [--dist <folder>]
 *
 * With --dist, every file the manifest points at on the dev server must also exist in that build folder
 * (run it after `npm run build`). Prints one line a finding and exits 1 if there is any.
 */
import { readFileSync } from "node:fs";
import path from "node:path";
import { checkManifest } from "./manifest-check.mjs";

function parseArgs(argv) {
  const args = { manifest: "manifest.xml", distDir: undefined };
  for (let i = 0; i < argv.length; i++) {
    if (argv[i] === "--dist") {
      args.distDir = argv[++i];
      if (!args.distDir) throw new Error("--dist needs a folder, e.g. --dist dist");
    } else if (argv[i].startsWith("-")) {
      throw new Error(`unknown option ${argv[i]} (allowed: --dist <folder>)`);
    } else {
      args.manifest = argv[i];
    }
  }
  return args;
}

let args;
let xml;
try {
  args = parseArgs(process.argv.slice(2));
  xml = readFileSync(args.manifest, "utf8");
} catch (error) {
  console.error(`validate-manifest: ${error.message}`);
  process.exit(2);
}
const findings = checkManifest(xml, { distDir: args.distDir && path.resolve(args.distDir) });
const where = args.distDir ? `${args.manifest} (with ${args.distDir}/)` : args.manifest;
if (findings.length === 0) {
  console.log(`${where}: OK, no findings (offline check; the hosted validator needs the network)`);
} else {
  console.error(`${where}: ${findings.length} finding${findings.length === 1 ? "" : "s"}`);
  for (const f of findings) console.error(`  ✗ [${f.code}] ${f.message}${f.at ? `  (at ${f.at})` : ""}`);
  process.exit(1);
}
