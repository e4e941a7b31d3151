/**
 * The shape of `lib/`: the import graph runs only downward through the
 * layers, third-party packages enter only through `lib/_deps/`, and no file
 * grows past the size one can read in a sitting. The rules are written out in
 * DEVELOPERS.md ("Layers").
 *
 * @module
 */
import assert from "node:assert/strict";

const LIB = new URL("../lib/", import.meta.url);

/** Layers from the bottom up: a module may import its own layer and those below it. */
const LAYERS = [
  "numeric",
  "stats",
  "reexpress",
  "stakes",
  "render",
  "data",
  "plumb",
  "scan",
] as const;
type Layer = (typeof LAYERS)[number];
/** Modules every layer may import: errors, the result types and display protocol, packages. */
const SHARED = ["errors", "results", "_deps"] as const;
/** Layers whose imports of stats, reexpress and stakes must be type-only: they handle plain results. */
const TYPES_ONLY_FROM_STATS: readonly string[] = ["render", "results"];

/** The hard limit on a file's length, and the length above which its header must say why. */
const HARD_LIMIT = 450;
const SOFT_LIMIT = 300;
const WHOLE = "Kept in one file because";
/**
 * Files allowed past the hard limit for now, each with the reason; the check
 * fails as soon as one of them no longer needs the allowance, so the list
 * can only shrink.
 */
const PENDING: Readonly<Record<string, string>> = {};

interface Import {
  readonly from: string; // path relative to lib/
  readonly to: string; // the specifier
  readonly typeOnly: boolean;
}

async function _files(dir: URL, prefix = ""): Promise<string[]> {
  const out: string[] = [];
  for await (const e of Deno.readDir(dir)) {
    if (e.isDirectory) out.push(...await _files(new URL(`${e.name}/`, dir), `${prefix}${e.name}/`));
    else if (e.name.endsWith(".ts")) out.push(`${prefix}${e.name}`);
  }
  return out.sort();
}

/** The code without comments (doc examples hold import lines that are not imports). */
function _code(text: string): string {
  return text.replace(/\/\*[\s\S]*?\*\//g, "").replace(/^\s*\/\/.*$/gm, "");
}

/** Static imports and re-exports, and dynamic import() calls with a literal specifier. */
function _imports(from: string, text: string): Import[] {
  const code = _code(text);
  const out: Import[] = [];
  const statement = /(?:^|\n)\s*(import|export)\s+(type\s+)?([^;]*?)\s*from\s*["']([^"']+)["']/g;
  for (const m of code.matchAll(statement)) {
    const clause = m[3];
    const names = clause.replace(/^[{]|[}]$/g, "").split(",").map((s) => s.trim()).filter(
      (s) => s !== "",
    );
    const allTyped = clause.startsWith("{") && names.length > 0 &&
      names.every((s) => s.startsWith("type "));
    out.push({ from, to: m[4], typeOnly: m[2] !== undefined || allTyped });
  }
  for (const m of code.matchAll(/(?:^|\n)\s*import\s*["']([^"']+)["']/g)) {
    out.push({ from, to: m[1], typeOnly: false });
  }
  for (const m of code.matchAll(/\bimport\(\s*["']([^"']+)["']\s*\)/g)) {
    out.push({ from, to: m[1], typeOnly: false });
  }
  return out;
}

/** The layer (or shared module) a path relative to lib/ belongs to. */
function _layerOf(path: string): string {
  if (path === "errors.ts") return "errors";
  return path.split("/")[0];
}

/** The target of a relative specifier, relative to lib/, or null when it leaves lib/. */
function _resolve(from: string, spec: string): string | null {
  const url = new URL(spec, new URL(from, LIB));
  return url.href.startsWith(LIB.href) ? url.href.slice(LIB.href.length) : null;
}

/** Why an import breaks the rules, or null when it keeps them. */
function _violation(imp: Import): string | null {
  const fromLayer = _layerOf(imp.from);
  if (imp.to.startsWith("node:")) return null; // the runtime's built-in modules
  if (!imp.to.startsWith(".")) {
    return fromLayer === "_deps" ? null : "imports a package directly (only lib/_deps/ may)";
  }
  const target = _resolve(imp.from, imp.to);
  if (target === null) return "imports from outside lib/";
  const toLayer = _layerOf(target);
  if (fromLayer === "_deps") return "a package wrapper imports plumbline code";
  if (fromLayer === "errors") return "errors.ts imports plumbline code";
  if (toLayer === "errors" || toLayer === "_deps" || toLayer === fromLayer) return null;
  if (toLayer === "results") return null;
  if (
    TYPES_ONLY_FROM_STATS.includes(fromLayer) &&
    (toLayer === "stats" || toLayer === "reexpress" || toLayer === "stakes")
  ) {
    return imp.typeOnly ? null : `${fromLayer} may import only types from ${toLayer}`;
  }
  if (fromLayer === "results") return `results may not import ${toLayer}`;
  const a = LAYERS.indexOf(fromLayer as Layer);
  const b = LAYERS.indexOf(toLayer as Layer);
  if (a < 0 || b < 0) return `unknown layer (${fromLayer} → ${toLayer})`;
  return b <= a ? null : `${fromLayer} imports ${toLayer}, which sits above it`;
}

const files = await _files(LIB);
const texts = new Map(
  await Promise.all(
    files.map(async (f) => [f, await Deno.readTextFile(new URL(f, LIB))] as const),
  ),
);

Deno.test("every folder of lib/ is a known layer or shared module", () => {
  const known: readonly string[] = [...LAYERS, ...SHARED];
  for (const f of files) assert.ok(known.includes(_layerOf(f)), `${f}: not in a known layer`);
});

Deno.test("lib/ imports only downward: numeric < stats < reexpress < stakes < render < data < plumb", () => {
  const bad: string[] = [];
  for (const [f, text] of texts) {
    for (const imp of _imports(f, text)) {
      const why = _violation(imp);
      if (why !== null) bad.push(`${f} → ${imp.to}: ${why}`);
    }
  }
  assert.deepEqual(bad, []);
});

Deno.test("the import rules catch what they are meant to catch", () => {
  const check = (from: string, line: string) => _imports(from, line).map(_violation);
  assert.deepEqual(check("stats/x.ts", 'import { a } from "../numeric/y.ts";'), [null]);
  assert.match(String(check("numeric/x.ts", 'import { a } from "../stats/y.ts";')[0]), /above/);
  assert.match(String(check("render/x.ts", 'import { a } from "../plumb/y.ts";')[0]), /above/);
  assert.match(String(check("data/x.ts", 'import { a } from "../plumb/y.ts";')[0]), /above/);
  assert.match(String(check("render/x.ts", 'import { a } from "../stats/y.ts";')[0]), /types/);
  assert.deepEqual(check("render/x.ts", 'import type { A } from "../stats/y.ts";'), [null]);
  assert.match(String(check("render/x.ts", 'import { a } from "../stakes/y.ts";')[0]), /types/);
  assert.match(String(check("stakes/x.ts", 'import { a } from "../render/y.ts";')[0]), /above/);
  assert.deepEqual(check("stakes/x.ts", 'import { a } from "../reexpress/y.ts";'), [null]);
  assert.deepEqual(check("render/x.ts", 'import { type A, type B } from "../stats/y.ts";'), [null]);
  assert.match(String(check("results/x.ts", 'import { a } from "../render/y.ts";')[0]), /results/);
  assert.deepEqual(check("numeric/x.ts", 'import { a } from "../results/y.ts";'), [null]);
  assert.match(String(check("stats/x.ts", 'import x from "npm:jstat@1.9.6";')[0]), /package/);
  assert.deepEqual(check("render/x.ts", 'import { deflateSync } from "node:zlib";'), [null]);
  assert.match(String(check("stats/x.ts", 'const m = await import("../plumb/y.ts");')[0]), /above/);
  // A doc example's import line is not an import.
  assert.deepEqual(check("stats/x.ts", '/**\n * import { a } from "../plumb/y.ts";\n */'), []);
});

Deno.test(`no lib/ file is longer than ${HARD_LIMIT} lines; past ${SOFT_LIMIT} its header says why`, () => {
  const bad: string[] = [];
  for (const [f, text] of texts) {
    const lines = text.split("\n").length - (text.endsWith("\n") ? 1 : 0);
    // Tables written by a generator script are data, not code to read: no limit.
    if (text.startsWith("// Generated by ")) continue;
    if (f in PENDING) {
      if (lines <= HARD_LIMIT) bad.push(`${f}: ${lines} lines now; remove it from PENDING`);
      continue;
    }
    if (lines > HARD_LIMIT) bad.push(`${f}: ${lines} lines`);
    else if (lines > SOFT_LIMIT && !text.slice(0, text.indexOf("@module")).includes(WHOLE)) {
      bad.push(`${f}: ${lines} lines and no "${WHOLE} …" in its module comment`);
    }
  }
  assert.deepEqual(bad, []);
});
