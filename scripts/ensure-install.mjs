#!/usr/bin/env node
/**
 * Runs `npm ci` when node_modules is missing or older than package-lock.json; otherwise returns at once.
 * Called first by `npm test` and `npm start`, so a fresh clone needs no separate install step.
 *
 * "Older" compares package-lock.json with node_modules/.package-lock.json, the copy npm writes after every
 * install (after package-lock.json itself), falling back to the node_modules folder's own time.
 */
import { spawnSync } from "node:child_process";
import { existsSync, statSync } from "node:fs";
import path from "node:path";
import { fileURLToPath } from "node:url";

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), "..");
const lock = path.join(root, "package-lock.json");
const modules = path.join(root, "node_modules");
const installed = path.join(modules, ".package-lock.json");

function reason() {
  if (!existsSync(modules)) return "node_modules is missing";
  if (!existsSync(lock)) return null; // nothing to compare with; npm ci would refuse anyway
  const stamp = existsSync(installed) ? installed : modules;
  if (statSync(lock).mtimeMs > statSync(stamp).mtimeMs) return "package-lock.json is newer than the installed packages";
  return null;
}

const why = reason();
if (why) {
  console.log(`ensure-install: ${why}; running npm ci`);
  const npm = process.platform === "win32" ? "npm.cmd" : "npm";
  const result = spawnSync(npm, ["ci"], { cwd: root, stdio: "inherit", shell: process.platform === "win32" });
  if (result.error) {
    console.error(`ensure-install: could not run npm ci: ${result.error.message}`);
    process.exit(1);
  }
  if (result.status !== 0) process.exit(result.status ?? 1);
}
