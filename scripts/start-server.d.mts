import type { Server } from "node:http";

/** Serve `dir` on the loopback interface; port 0 picks a free port. */
export function startServer(opts: { dir: string; port?: number; host?: string }): Promise<{ server: Server; port: number; url: string }>;
