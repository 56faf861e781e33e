#!/usr/bin/env node
/**
 * Interim `npm start`: serves the built add-in (dist/) on http://localhost:3000, loopback only, and says how to load
 * it into Excel. Excel itself needs https, which the webpack dev server provides (`npm run dev-server`).
 *
 *   node scripts/serve.mjs [--port 3000] [--dir dist]
 */
import { createReadStream, existsSync, statSync } from "node:fs";
import { createServer } from "node:http";
import path from "node:path";
import { fileURLToPath } from "node:url";

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), "..");
const args = process.argv.slice(2);
const option = (name, fallback) => {
  const i = args.indexOf(name);
  return i >= 0 && args[i + 1] ? args[i + 1] : fallback;
};
const port = Number(option("--port", process.env.PORT ?? "3000"));
const dir = path.resolve(root, option("--dir", "dist"));

const TYPES = {
  ".html": "text/html; charset=utf-8",
  ".js": "text/javascript; charset=utf-8",
  ".json": "application/json; charset=utf-8",
  ".map": "application/json; charset=utf-8",
  ".png": "image/png",
  ".css": "text/css; charset=utf-8",
  ".svg": "image/svg+xml",
  ".txt": "text/plain; charset=utf-8",
  ".xlsx": "application/vnd.openxmlformats-officedocument.spreadsheetml.sheet",
};

if (!Number.isInteger(port) || port < 1 || port > 65535) {
  console.error(`serve: --port must be a whole number from 1 to 65535, got "${option("--port", "")}"`);
  process.exit(2);
}
if (!existsSync(path.join(dir, "taskpane.html"))) {
  console.error(`serve: ${path.relative(root, dir) || dir}/taskpane.html not found; run npm run build first`);
  process.exit(1);
}

const server = createServer((req, res) => {
  let pathname;
  try {
    pathname = decodeURIComponent(new URL(req.url ?? "/", "http://localhost").pathname);
  } catch {
    res.writeHead(400).end("bad request");
    return;
  }
  if (pathname === "/") pathname = "/taskpane.html";
  const file = path.join(dir, path.normalize(pathname));
  if (!file.startsWith(dir + path.sep) || !existsSync(file) || !statSync(file).isFile()) {
    res.writeHead(404, { "Content-Type": "text/plain; charset=utf-8" }).end(`not found: ${pathname}`);
    return;
  }
  res.writeHead(200, {
    "Content-Type": TYPES[path.extname(file)] ?? "application/octet-stream",
    "Cache-Control": "no-store",
  });
  if (req.method === "HEAD") res.end();
  else createReadStream(file).pipe(res);
});

server.on("error", (error) => {
  const busy = error.code === "EADDRINUSE";
  console.error(`serve: ${busy ? `port ${port} is in use (is npm run dev-server running? stop it, or pass --port)` : error.message}`);
  process.exit(1);
});

server.listen(port, "127.0.0.1", () => {
  console.log(`Headroom add-in build served from ${path.relative(root, dir)}/ at http://localhost:${port}/taskpane.html`);
  console.log(`(loopback only; Ctrl+C stops it)`);
  console.log("");
  console.log("To load Headroom into Excel (sideloading needs https, so use the dev server instead of this one):");
  console.log("  1. Stop this server, then run: npm run dev-server   (https://localhost:3000, creates a local certificate)");
  console.log("  2. Open https://localhost:3000/taskpane.html once in your browser and accept the certificate.");
  console.log("  3. Excel on the web (https://www.office.com): open a workbook, Home > Add-ins > More Settings >");
  console.log("     Upload My Add-in, and choose manifest.xml from this folder. Excel on Windows or Mac: npm run start:excel.");
  console.log("  4. Type =HEADROOM. in a cell; the Home tab gets a \"Supply vs demand\" button for the pane.");
});
