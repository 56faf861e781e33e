/**
 * Every published source the code and the tests cite is listed in docs/references.md.
 *
 * A source key is written in brackets: a publisher's name in capitals and a designation holding a digit, such as
 * [NFPA 13], [ASME B36.10M] or [EN 12845] (also inside a regular expression, [AWWA C900\]). The files read are the
 * repository's own text: src/, test/, bench/, scripts/, samples/, README.md and DEVELOPERS.md. The keys listed are
 * the first cells of the tables of docs/references.md.
 */
import { readFileSync, readdirSync } from "node:fs";
import { join, relative } from "node:path";
import { fileURLToPath } from "node:url";
import { describe, expect, it } from "vitest";

const ROOT = fileURLToPath(new URL("..", import.meta.url));
const SCANNED_DIRS = ["src", "test", "bench", "scripts", "samples"];
const SCANNED_FILES = ["README.md", "DEVELOPERS.md"];
const TEXT_FILE = /\.(ts|mts|cts|js|mjs|cjs|md|html|css)$/;
/** A bracketed source key: capitalised words, then a designation with a digit; `\]` as a regex writes it. */
const SOURCE_KEY = /\[([A-Z][A-Za-z]*(?: [A-Z][A-Za-z]*)* [A-Z]{0,4}\d[0-9A-Za-z.\-/]*)\\?\]/g;
/** A listed key: the first cell of a table row of docs/references.md. */
const LISTED_KEY = /^\| \[([^\]]+)\] \|/gm;

function textFiles(dir: string): string[] {
  return readdirSync(dir, { withFileTypes: true }).flatMap((entry) => {
    const path = join(dir, entry.name);
    if (entry.isDirectory()) return entry.name === "node_modules" ? [] : textFiles(path);
    return TEXT_FILE.test(entry.name) ? [path] : [];
  });
}

/** The source keys cited in `text`. */
function citedKeys(text: string): string[] {
  return [...text.matchAll(SOURCE_KEY)].map((m) => m[1]);
}

/** Each cited key with the files (relative to the repository) that cite it. */
function citations(): Map<string, string[]> {
  const files = [...SCANNED_DIRS.flatMap((d) => textFiles(join(ROOT, d))), ...SCANNED_FILES.map((f) => join(ROOT, f))];
  const byKey = new Map<string, string[]>();
  for (const file of files) {
    for (const key of new Set(citedKeys(readFileSync(file, "utf8")))) {
      byKey.set(key, [...(byKey.get(key) ?? []), relative(ROOT, file)]);
    }
  }
  return byKey;
}

const referencesText = readFileSync(join(ROOT, "docs/references.md"), "utf8");
const listed = new Set([...referencesText.matchAll(LISTED_KEY)].map((m) => m[1]));

describe("source keys", () => {
  it("are recognised as keys, and code in brackets is not", () => {
    expect(citedKeys("loss [NFPA 13] (from memory); ID [ASME B36.10M]; /\\[AWWA C900\\] \\(from memory\\)/")).toEqual([
      "NFPA 13",
      "ASME B36.10M",
      "AWWA C900",
    ]);
    // Built from parts, so that this file does not itself cite sources that are not listed.
    const unlistedSources = ["ISO 6182-1", "FM Global DS 2-0"];
    expect(citedKeys(`a new source ${unlistedSources.map((k) => `[${k}]`).join(" or ")}`)).toEqual(unlistedSources);
    const code = "/[A-Z0-9]/ xs[K] m[1] [ML] NAME_MEANINGS[n] [STANDARD_RATED.length - 1] [Loading into Excel]";
    expect(citedKeys(code)).toEqual([]);
  });

  it("are found where the engine cites them", () => {
    const cited = citations();
    expect(cited.get("NFPA 13")).toContain("src/engine/friction.ts");
    expect(cited.get("NFPA 291")).toContain("src/engine/supply.ts");
  });

  it("cited anywhere are all listed in docs/references.md", () => {
    const unlisted = [...citations()]
      .filter(([key]) => !listed.has(key))
      .map(([key, files]) => `[${key}] cited in ${files.join(", ")}`);
    expect(unlisted, "add these sources to docs/references.md").toEqual([]);
  });

  it("listed in docs/references.md are all cited somewhere", () => {
    const cited = citations();
    expect([...listed].filter((key) => !cited.has(key))).toEqual([]);
  });
});

describe("docs/references.md", () => {
  it("explains the marks and names the outside checks the tests use", () => {
    for (const mark of ["**(from memory)**", "**(common practice)**"]) expect(referencesText).toContain(mark);
    for (const library of ["| python3-fluids |", "| mathjs |"]) expect(referencesText).toContain(library);
  });
});
