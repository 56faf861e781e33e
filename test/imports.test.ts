/**
 * No import circle in src/: between modules (src/workbook/port.ts imports src/workbook/template.ts, which imports
 * port.ts back) or between the folders of src/ (something in workbook/ imports preview/, something in preview/
 * imports workbook/). Type-only imports count: a circle through a type is still a circle in the design, even though
 * it vanishes from the bundle.
 *
 * Imports are read with TypeScript's parser: `import`, `import type`, `export ... from`, `import("...")` and
 * `typeof import("...")`, relative specifiers only (packages cannot import back).
 *
 * KNOWN_* list circles tolerated for a while (none today): a circle not listed fails, and so does a listed circle
 * that is gone.
 */
import { readFileSync, readdirSync } from "node:fs";
import { dirname, join, relative, resolve, sep } from "node:path";
import { fileURLToPath } from "node:url";
import ts from "typescript";
import { describe, expect, it } from "vitest";

/** Module circles tolerated, each as the sorted files of one strongly connected group: none. */
const KNOWN_MODULE_CIRCLES: string[][] = [];
/** Folder circles tolerated, each as the sorted folders of one strongly connected group: none. */
const KNOWN_FOLDER_CIRCLES: string[][] = [];

const ROOT = fileURLToPath(new URL("..", import.meta.url));
const SOURCE = /\.(ts|tsx|mts)$/;
const RESOLVE_SUFFIXES = ["", ".ts", ".tsx", ".mts", "/index.ts"];

type Graph = Map<string, Set<string>>;

function sourceFiles(dir: string): string[] {
  return readdirSync(dir, { withFileTypes: true }).flatMap((e) => {
    const path = join(dir, e.name);
    if (e.isDirectory()) return sourceFiles(path);
    return SOURCE.test(e.name) ? [path] : [];
  });
}

/** Every module specifier `text` imports or re-exports, dynamic and type-only ones included. */
function importSpecifiers(fileName: string, text: string): string[] {
  const found: string[] = [];
  const visit = (node: ts.Node): void => {
    if ((ts.isImportDeclaration(node) || ts.isExportDeclaration(node)) && node.moduleSpecifier) {
      if (ts.isStringLiteral(node.moduleSpecifier)) found.push(node.moduleSpecifier.text);
    } else if (ts.isCallExpression(node) && node.expression.kind === ts.SyntaxKind.ImportKeyword) {
      const [arg] = node.arguments;
      if (arg !== undefined && ts.isStringLiteralLike(arg)) found.push(arg.text);
    } else if (ts.isImportTypeNode(node) && ts.isLiteralTypeNode(node.argument)) {
      const lit = node.argument.literal;
      if (ts.isStringLiteral(lit)) found.push(lit.text);
    }
    ts.forEachChild(node, visit);
  };
  visit(ts.createSourceFile(fileName, text, ts.ScriptTarget.Latest, false, ts.ScriptKind.TS));
  return found;
}

/** The module graph of src/: file → the files of src/ it imports (paths relative to the repository, with "/"). */
function moduleGraph(): Graph {
  const files = sourceFiles(join(ROOT, "src"));
  const known = new Set(files);
  const name = (path: string) => relative(ROOT, path).split(sep).join("/");
  const graph: Graph = new Map();
  for (const file of files) {
    const targets = new Set<string>();
    for (const spec of importSpecifiers(file, readFileSync(file, "utf8"))) {
      if (!spec.startsWith(".")) continue;
      const base = resolve(dirname(file), spec);
      const target = RESOLVE_SUFFIXES.map((s) => base + s).find((p) => known.has(p));
      // A relative import that resolves to no source file (a .json, a .css) cannot import back.
      if (target !== undefined) targets.add(name(target));
    }
    graph.set(name(file), targets);
  }
  return graph;
}

/** The folder graph: src/<folder> → the other folders of src/ its files import (a file right in src/ is its own). */
function folderGraph(modules: Graph): Graph {
  const folder = (file: string) => file.split("/").slice(0, file.split("/").length > 2 ? 2 : undefined).join("/");
  const graph: Graph = new Map();
  for (const [from, targets] of modules) {
    const edges = graph.get(folder(from)) ?? new Set<string>();
    for (const to of targets) if (folder(to) !== folder(from)) edges.add(folder(to));
    graph.set(folder(from), edges);
  }
  return graph;
}

/** The strongly connected groups of more than one node (or a node importing itself), each sorted (Tarjan). */
function circles(graph: Graph): string[][] {
  const index = new Map<string, number>();
  const low = new Map<string, number>();
  const stack: string[] = [];
  const onStack = new Set<string>();
  const groups: string[][] = [];
  const connect = (v: string): void => {
    index.set(v, index.size);
    low.set(v, index.get(v)!);
    stack.push(v);
    onStack.add(v);
    for (const w of graph.get(v) ?? []) {
      if (!index.has(w)) {
        connect(w);
        low.set(v, Math.min(low.get(v)!, low.get(w)!));
      } else if (onStack.has(w)) {
        low.set(v, Math.min(low.get(v)!, index.get(w)!));
      }
    }
    if (low.get(v) === index.get(v)) {
      const group: string[] = [];
      let w: string;
      do {
        w = stack.pop()!;
        onStack.delete(w);
        group.push(w);
      } while (w !== v);
      if (group.length > 1 || graph.get(v)?.has(v)) groups.push(group.sort());
    }
  };
  for (const v of [...graph.keys()].sort()) if (!index.has(v)) connect(v);
  return groups.sort((a, b) => a[0].localeCompare(b[0]));
}

/** One shortest way round a group, from its first node back to it: "a → b → a". */
function describeCircle(graph: Graph, group: string[]): string {
  const members = new Set(group);
  const start = group[0];
  const previous = new Map<string, string>();
  const queue = [start];
  while (queue.length > 0) {
    const v = queue.shift()!;
    for (const w of graph.get(v) ?? []) {
      if (!members.has(w)) continue;
      if (w === start) {
        const path = [v];
        while (path[0] !== start) path.unshift(previous.get(path[0])!);
        return [...path, start].join(" → ");
      }
      if (!previous.has(w)) {
        previous.set(w, v);
        queue.push(w);
      }
    }
  }
  return group.join(", ");
}

/** The circles of `graph` not in `known`, and the ones in `known` no longer there, as sentences. */
function compare(graph: Graph, known: string[][]): string[] {
  const key = (g: string[]) => g.join(" | ");
  const found = circles(graph);
  const knownKeys = new Set(known.map(key));
  const foundKeys = new Set(found.map(key));
  return [
    ...found
      .filter((g) => !knownKeys.has(key(g)))
      .map((g) => `import circle among ${g.join(", ")}, for one: ${describeCircle(graph, g)}`),
    ...known
      .filter((g) => !foundKeys.has(key(g)))
      .map((g) => `no longer a circle, delete it from the known list: ${key(g)}`),
  ];
}

describe("the circle finder", () => {
  it("reads static, type-only, re-exported and dynamic imports, not comments or strings", () => {
    const text = [
      'import { a } from "./a";',
      'import type { B } from "./b";',
      'export { c } from "./c";',
      'export * from "./d";',
      'import "./e";',
      'type X = typeof import("./f");',
      'const g = () => import(/* chunk */ "./g");',
      '// import { h } from "./h";',
      'const s = "import { i } from \'./i\'";',
    ].join("\n");
    expect(importSpecifiers("x.ts", text)).toEqual(["./a", "./b", "./c", "./d", "./e", "./f", "./g"]);
  });

  it("finds each circle once, and none in a graph without one", () => {
    const graph: Graph = new Map([
      ["a", new Set(["b"])],
      ["b", new Set(["c"])],
      ["c", new Set(["a", "d"])],
      ["d", new Set<string>()],
      ["e", new Set(["e"])],
    ]);
    expect(circles(graph)).toEqual([["a", "b", "c"], ["e"]]);
    expect(describeCircle(graph, ["a", "b", "c"])).toBe("a → b → c → a");
    graph.set("c", new Set(["d"]));
    expect(circles(graph)).toEqual([["e"]]);
  });
});

describe("src/", () => {
  const modules = moduleGraph();

  it("reads the imports of every source file", () => {
    // src/functions/supply.ts imports the engine: a graph without that edge has not read the files.
    expect(modules.get("src/functions/supply.ts")?.size ?? 0).toBeGreaterThan(0);
  });

  it("has no import circle between modules but the known ones", () => {
    expect(compare(modules, KNOWN_MODULE_CIRCLES)).toEqual([]);
  });

  it("has no import circle between its folders but the known ones", () => {
    expect(compare(folderGraph(modules), KNOWN_FOLDER_CIRCLES)).toEqual([]);
  });
});
