/**
 * The production add-in bundles reach no remote origin but Office.js's own: the test builds them (webpack, production,
 * into a temporary folder) and reads every URL in the emitted scripts and pages. XML namespace names (the SVG
 * namespace the plot is drawn in) are identifiers, not addresses anything loads, and are allowed by name.
 * It also checks that HyperFormula (GPL-3.0, preview only) and mathjs's expression parser stay out of the bundle.
 */
import { mkdtempSync, readFileSync, readdirSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import webpack from "webpack";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
// @ts-expect-error: the webpack configuration is plain JavaScript
import { addinConfig } from "../../webpack.config.js";

/**
 * Office.js from Microsoft's CDN, which now serves it from officeapis.public.onecdn.static.microsoft
 * (https://github.com/OfficeDev/office-js-docs-pr/pull/5882, "Update CDN URL to OCDI URL"; the same move in Microsoft's
 * samples: https://github.com/OfficeDev/office-js-snippets/pull/1119).
 */
const OFFICE_JS = "https://officeapis.public.onecdn.static.microsoft/1/office.js";
/**
 * Every remote origin the pane page's Content-Security-Policy may name: Office.js's CDN alone. Office.js loads its
 * host files (excel-web-16.00.js, ...), string tables and the host-trust page (AgaveErrorUX, in a frame, Excel on the
 * web) from the folder it was itself loaded from (getOfficeJsBasePath in @microsoft/office-js 1.1.110's office.js and
 * excel-*-16.*.js). Hosts others report (https://github.com/OfficeDev/office-js/issues/1005) that it does not need:
 * ajax.aspnetcdn.com (MicrosoftAjax.js: office.js loads it only when `requiresMsAjax`, which it never sets),
 * *.pipe.aria.microsoft.com (telemetry), alcdn.msauth.net (Microsoft's own first-party sign-in) and
 * appsforoffice.microsoft.com (the former CDN, no longer the one the page loads Office.js from).
 */
const OFFICE_JS_ORIGINS = ["https://officeapis.public.onecdn.static.microsoft"];
const NAMESPACES = new Set(["http://www.w3.org/2000/svg", "http://www.w3.org/1999/xhtml", "http://www.w3.org/1999/xlink"]);
const URL_PATTERN = /\b(?:https?:)?\/\/[a-z0-9.-]+\.[a-z]{2,}[^\s"'`)<>\\;]*/gi;

let out = "";
const files: Record<string, string> = {};
let metadataJson = "";

beforeAll(async () => {
  out = mkdtempSync(path.join(tmpdir(), "headroom-bundle-"));
  const config = addinConfig("production");
  config.output = { ...config.output, path: out, clean: true };
  config.devtool = false;
  const stats = await new Promise<webpack.Stats>((resolve, reject) =>
    webpack(config, (err, s) => (err ? reject(err) : s ? resolve(s) : reject(new Error("no stats")))),
  );
  if (stats.hasErrors()) throw new Error(stats.toString({ all: false, errors: true }));
  for (const name of readdirSync(out)) {
    if (/\.(js|html)$/.test(name)) files[name] = readFileSync(path.join(out, name), "utf8");
  }
  metadataJson = readFileSync(path.join(out, "functions.json"), "utf8");
}, 240_000);

afterAll(() => {
  if (out) rmSync(out, { recursive: true, force: true });
});

describe("production add-in bundles", () => {
  it("emit the functions bundle, the pane bundle and the shared-runtime page, and the summary's dialog page", () => {
    expect(Object.keys(files).sort()).toEqual(expect.arrayContaining(["functions.js", "taskpane.html", "taskpane.js", "summary.html", "summary.js"]));
    // the dialog page loads its own bundle and Office.js, and not the pane's bundles
    expect(files["summary.html"]).toContain(OFFICE_JS);
    expect(files["summary.html"]).toMatch(/<script[^>]+src="?summary\.js"?[\s>]/);
    expect(files["summary.html"]).not.toMatch(/taskpane\.js|functions\.js/);
  });

  it("name no remote URL but Office.js (XML namespace names aside)", () => {
    const found = Object.entries(files).flatMap(([name, text]) => [...text.matchAll(URL_PATTERN)].map((m) => `${name}: ${m[0]}`));
    const remote = found.filter((f) => {
      const url = f.slice(f.indexOf(": ") + 2);
      return url !== OFFICE_JS && !OFFICE_JS_ORIGINS.includes(url) && !NAMESPACES.has(url.replace(/^\/\//, "http://"));
    });
    expect(remote).toEqual([]);
    expect(files["taskpane.html"]).toContain(OFFICE_JS);
  });

  it("the pane page carries a Content-Security-Policy allowing no remote origin but Office.js's", () => {
    const csp = /http-equiv="?Content-Security-Policy"?\s+content="([^"]+)"/.exec(files["taskpane.html"])?.[1] ?? "";
    expect(csp).toMatch(/default-src 'self'/);
    const origins = [...csp.matchAll(/https?:\/\/[^\s;]+/g)].map((m) => m[0]);
    expect(origins.length).toBeGreaterThan(0);
    expect(new Set(origins)).toEqual(new Set(OFFICE_JS_ORIGINS));
    // no evaluation from strings, in any bundle (see "development add-in bundles")
    expect(csp).not.toMatch(/unsafe-eval/);
    const directive = (name: string) => new RegExp(`(?:^|;)\\s*${name}\\s+([^;]*)`).exec(csp)?.[1].trim().split(/\s+/) ?? [];
    // Office.js itself, and the frame it opens on Excel on the web, come from its own CDN
    const officeOrigin = new URL(OFFICE_JS).origin;
    expect(directive("script-src")).toContain(officeOrigin);
    expect(directive("frame-src")).toContain(officeOrigin);
  });

  it("the summary's dialog page carries the pane's Content-Security-Policy, word for word", () => {
    const csp = (page: string) => /http-equiv="?Content-Security-Policy"?\s+content="([^"]+)"/.exec(files[page])?.[1].replace(/\s+/g, " ").trim() ?? "";
    expect(csp("summary.html")).not.toBe("");
    expect(csp("summary.html")).toBe(csp("taskpane.html"));
  });

  it("ship functions.json without allowCustomDataForDataTypeAny (data-typed cells stay basic values; see test/requirements.test.ts)", () => {
    const metadata = JSON.parse(metadataJson);
    expect(metadata.functions.length).toBeGreaterThan(0);
    expect(metadata).not.toHaveProperty("allowCustomDataForDataTypeAny");
  });

  it("carry neither HyperFormula nor mathjs's expression parser", () => {
    const js = files["functions.js"] + files["taskpane.js"];
    // (booleans, not the bundle text, so that a failure does not print the whole bundle)
    expect(/HyperFormula|handsontable/.test(js), "HyperFormula in the add-in bundle").toBe(false);
    // messages only mathjs's expression parser (expression/parse.js) carries; the unit-only build has none
    expect(/Unexpected end of expression|False part of conditional expression expected/.test(js), "mathjs parser in the bundle").toBe(false);
    // and the bundle does hold mathjs's unit code, which UNIT uses
    expect(js.includes("gallon")).toBe(true);
  });
});

/**
 * `npm run dev-server` and `npm run start:excel` serve the development build, and the pane page's
 * Content-Security-Policy has no 'unsafe-eval': a bundle that evaluates its modules from strings (webpack's eval-*
 * source maps) stops at its first module, so every cell function and the pane fail to load. The development build
 * is built here as configured (its source map included), into a temporary folder.
 */
describe("development add-in bundles", () => {
  let devOut = "";
  let devtool: unknown;
  const dev: Record<string, string> = {};
  let maps: string[] = [];

  beforeAll(async () => {
    devOut = mkdtempSync(path.join(tmpdir(), "headroom-dev-bundle-"));
    const config = addinConfig("development");
    devtool = config.devtool;
    config.output = { ...config.output, path: devOut, clean: true };
    const stats = await new Promise<webpack.Stats>((resolve, reject) =>
      webpack(config, (err, s) => (err ? reject(err) : s ? resolve(s) : reject(new Error("no stats")))),
    );
    if (stats.hasErrors()) throw new Error(stats.toString({ all: false, errors: true }));
    const names = readdirSync(devOut);
    for (const name of names) if (name.endsWith(".js")) dev[name] = readFileSync(path.join(devOut, name), "utf8");
    maps = names.filter((n) => n.endsWith(".js.map"));
  }, 240_000);

  afterAll(() => {
    if (devOut) rmSync(devOut, { recursive: true, force: true });
  });

  it("evaluate no code from strings (the pane's Content-Security-Policy has no 'unsafe-eval')", () => {
    expect(Object.keys(dev)).toEqual(expect.arrayContaining(["functions.js", "taskpane.js", "summary.js"]));
    const counts = Object.entries(dev).map(([name, text]) => [name, (text.match(/\beval\s*\(|\bnew\s+Function\s*\(/g) ?? []).length]);
    expect(counts.filter(([, n]) => n !== 0)).toEqual([]);
  });

  it("still come with source maps, as separate files", () => {
    expect(String(devtool)).not.toMatch(/eval/);
    expect(maps.sort()).toEqual(expect.arrayContaining(["functions.js.map", "taskpane.js.map", "summary.js.map"]));
  });
});

describe("no evaluation of user text", () => {
  it("no source file of the project calls eval or new Function", () => {
    const offenders: string[] = [];
    const walk = (dir: string) => {
      for (const entry of readdirSync(dir, { withFileTypes: true })) {
        const p = path.join(dir, entry.name);
        if (entry.isDirectory()) walk(p);
        else if (/\.(ts|js|mjs)$/.test(entry.name) && /\beval\s*\(|new\s+Function\s*\(/.test(readFileSync(p, "utf8"))) offenders.push(p);
      }
    };
    walk("src");
    expect(offenders).toEqual([]);
  });

  it("UNIT looks unit names up in its own list and never hands text to mathjs's parser", async () => {
    const { convertUnit } = await import("../../src/functions/units");
    // an expression mathjs's parser would evaluate is just an unknown unit here
    expect(() => convertUnit(1, "2+2", "m")).toThrow(/from: got "2\+2"; must be one of/);
    expect(() => convertUnit(1, "ft", "import('x')")).toThrow(/to: got/);
  });
});
