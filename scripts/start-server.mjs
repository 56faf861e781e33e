/**
 * A small static file server for the built dist/ folder, on the loopback interface only: what `npm start` and the
 * browser tests use. "/" opens the preview (dist/preview/index.html, which opens the sample estimate).
 *
 *   const { server, url } = await startServer({ dir: "dist", port: 3000 });   // port 0: any free port
 */
import { createReadStream, existsSync, statSync } from "node:fs";
import { createServer } from "node:http";
import path from "node:path";

const TYPES = {
  ".html": "text/html; charset=utf-8",
  ".js": "text/javascript; charset=utf-8",
  ".mjs": "text/javascript; charset=utf-8",
  ".json": "application/json; charset=utf-8",
  ".map": "application/json; charset=utf-8",
  ".css": "text/css; charset=utf-8",
  ".png": "image/png",
  ".svg": "image/svg+xml",
  ".txt": "text/plain; charset=utf-8",
  ".xml": "application/xml; charset=utf-8",
  ".xlsx": "application/vnd.openxmlformats-officedocument.spreadsheetml.sheet",
};

/** Serve `dir` on 127.0.0.1:`port` (0 for any free port). Resolves when listening. */
export function startServer({ dir, port = 0, host = "127.0.0.1" }) {
  const root = path.resolve(dir);
  const server = createServer((req, res) => {
    let pathname;
    try {
      pathname = decodeURIComponent(new URL(req.url ?? "/", "http://localhost").pathname);
    } catch {
      res.writeHead(400, { "Content-Type": "text/plain; charset=utf-8" }).end("bad request");
      return;
    }
    if (pathname === "/" || pathname === "/preview") {
      res.writeHead(302, { Location: "/preview/" }).end();
      return;
    }
    if (pathname.endsWith("/")) pathname += "index.html";
    const file = path.join(root, path.normalize(pathname));
    if (!file.startsWith(root + path.sep) || !existsSync(file) || !statSync(file).isFile()) {
      res.writeHead(404, { "Content-Type": "text/plain; charset=utf-8" }).end(`not found: ${pathname}`);
      return;
    }
    res.writeHead(200, {
      "Content-Type": TYPES[path.extname(file)] ?? "application/octet-stream",
      "Cache-Control": "no-store",
      "X-Content-Type-Options": "nosniff",
    });
    if (req.method === "HEAD") res.end();
    else createReadStream(file).pipe(res);
  });
  return new Promise((resolve, reject) => {
    server.once("error", reject);
    server.listen(port, host, () => {
      server.off("error", reject);
      const address = server.address();
      resolve({ server, port: address.port, url: `http://${host === "127.0.0.1" ? "localhost" : host}:${address.port}/` });
    });
  });
}
