#!/usr/bin/env node
/**
 * `npm run start:excel` / `npm stop`: sideloads manifest.xml into desktop Excel with office-addin-debugging
 * (which also starts the https dev server), or stops it again.
 *
 * Desktop Excel exists only on Windows and macOS. Elsewhere (Linux) office-addin-debugging would fail with
 * "Platform not supported", so this prints how to use Excel on the web instead.
 * office-addin-debugging is not a devDependency (its dependency keytar needs a native build that fails without
 * libsecret); it is run through npx at a pinned version when not installed locally.
 *
 *   node scripts/excel.mjs start|stop
 */
import { spawnSync } from "node:child_process";
import { existsSync } from "node:fs";
import path from "node:path";
import { fileURLToPath } from "node:url";

const DEBUGGING_VERSION = "7.0.0";
const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), "..");
const command = process.argv[2];

if (command !== "start" && command !== "stop") {
  console.error(`excel: say start or stop (got "${command ?? ""}")`);
  process.exit(2);
}

if (process.platform !== "win32" && process.platform !== "darwin") {
  if (command === "start") {
    console.log(`Desktop Excel does not run on ${process.platform}; load Headroom into Excel on the web instead:`);
    console.log("  1. npm run dev-server   (serves the add-in on https://localhost:3000; leave it running)");
    console.log("  2. Open https://localhost:3000/taskpane.html once in the browser and accept the local certificate.");
    console.log("  3. In Excel on the web (https://www.office.com, any workbook): Home > Add-ins > More Settings >");
    console.log("     Upload My Add-in, and choose manifest.xml from this folder.");
    console.log("  4. Chrome and other Chromium-based browsers (Edge) ask whether the page may access devices on your");
    console.log("     local network (the add-in comes from localhost): choose Allow.");
    console.log("  5. Type =HEADROOM. in a cell; the Home tab gets a \"Supply vs demand\" button for the pane.");
  } else {
    console.log(`Nothing was sideloaded on ${process.platform}. Stop npm run dev-server with Ctrl+C in its terminal;`);
    console.log("Excel on the web keeps an uploaded manifest in the browser's local storage: clearing the site data removes it.");
  }
  process.exit(0);
}

const local = path.join(root, "node_modules", ".bin", process.platform === "win32" ? "office-addin-debugging.cmd" : "office-addin-debugging");
const [exe, args] = existsSync(local)
  ? [local, [command, "manifest.xml"]]
  : ["npx", ["--yes", `office-addin-debugging@${DEBUGGING_VERSION}`, command, "manifest.xml"]];
const result = spawnSync(exe, args, { cwd: root, stdio: "inherit", shell: process.platform === "win32" });
if (result.error) {
  console.error(`excel: could not run office-addin-debugging: ${result.error.message}`);
  process.exit(1);
}
process.exit(result.status ?? 1);
