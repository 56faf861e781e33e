#!/usr/bin/env node
/**
 * `npm start` (after the install check and the build): serves dist/ on the loopback interface and prints the URL of
 * the preview, which opens the sample estimate in a grid recalculated by the same cell functions, with the task pane
 * beside it. Nothing is fetched from anywhere else.
 *
 *   node scripts/start.mjs [--port 3000] [--open]
 *     --port  the port to listen on (default 3000, or $PORT; the next ones are tried when it is taken)
 *     --open  also open the page in this computer's web browser
 */
import { spawn } from "node:child_process";
import { existsSync } from "node:fs";
import path from "node:path";
import { fileURLToPath } from "node:url";
import { startServer } from "./start-server.mjs";

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), "..");
const args = process.argv.slice(2);
const option = (name, fallback) => {
  const i = args.indexOf(name);
  return i >= 0 && args[i + 1] ? args[i + 1] : fallback;
};
const wanted = Number(option("--port", process.env.PORT ?? "3000"));
const dist = path.join(root, "dist");
const TRIES = 10;

if (!Number.isInteger(wanted) || wanted < 0 || wanted > 65535) {
  console.error(`start: --port must be a whole number from 0 to 65535, got "${option("--port", "")}"`);
  process.exit(2);
}
if (!existsSync(path.join(dist, "preview", "index.html")) || !existsSync(path.join(dist, "functions.json"))) {
  console.error("start: dist/preview/index.html or dist/functions.json is missing; run npm run build first");
  process.exit(1);
}

let started;
for (let i = 0; i < TRIES && !started; i++) {
  const port = wanted === 0 ? 0 : wanted + i;
  try {
    started = await startServer({ dir: dist, port });
  } catch (e) {
    if (e.code !== "EADDRINUSE" || wanted === 0) {
      console.error(`start: ${e.message}`);
      process.exit(1);
    }
    console.log(`start: port ${port} is in use, trying ${port + 1}`);
  }
}
if (!started) {
  console.error(`start: ports ${wanted} to ${wanted + TRIES - 1} are all in use; pass --port`);
  process.exit(1);
}

const url = `${started.url}preview/`;
console.log("");
console.log(`  Headroom preview: ${url}`);
console.log("");
console.log("  The sample estimate opens in a worksheet recalculated by the Headroom cell functions, with the task pane");
console.log("  beside it. Other samples: the Sample menu. Open and save .xlsx files with the buttons above the sheet.");
console.log("  Served from dist/ on this computer only (loopback); nothing is loaded from anywhere else. Ctrl+C stops it.");
console.log("  In Excel itself: npm run start:excel (sideload), or upload manifest.xml to Excel on the web.");
console.log("");

if (args.includes("--open")) {
  const opener = process.platform === "darwin" ? "open" : process.platform === "win32" ? "explorer" : "xdg-open";
  const child = spawn(opener, [url], { stdio: "ignore", detached: true });
  child.on("error", () => console.log(`  (could not start a browser with ${opener}; open the address above yourself)`));
  child.unref();
}

const stop = () => started.server.close(() => process.exit(0));
process.on("SIGINT", stop);
process.on("SIGTERM", stop);
