/**
 * No call in lib/ spreads an array into the arguments of a function that
 * takes any number of them (`Math.max(...values)`, `push(...rows)`,
 * `String.fromCharCode(...bytes)`): each argument takes a stack slot, so a
 * spread of some hundred thousand values throws "Maximum call stack size
 * exceeded" (130,000 groups did). Rest parameters in declarations are fine,
 * and so is a pair spread into a function of fixed arity (`_span(...ci)`).
 */
import assert from "node:assert/strict";

const LIB = new URL("../lib/", import.meta.url);

async function files(dir: URL): Promise<URL[]> {
  const out: URL[] = [];
  for await (const e of Deno.readDir(dir)) {
    if (e.isDirectory) out.push(...await files(new URL(`${e.name}/`, dir)));
    else if (e.name.endsWith(".ts")) out.push(new URL(e.name, dir));
  }
  return out;
}

/** Call spreads on one line (a call's own argument list, not inside `{}` or `[]`). */
function callSpreads(line: string): string[] {
  const out: string[] = [];
  const variadic =
    /(?:\bMath\.(?:max|min|hypot)|\.(?:push|unshift|splice|concat|apply)|\bfromCharCode|\bfromCodePoint|\bArray\.of)\s*\(([^()[\]{}]*?)\.\.\.\s*([\w$.[\]]+)(\s*:)?/g;
  for (const m of line.matchAll(variadic)) {
    if (m[3] !== undefined || /\bfunction\b/.test(line.slice(0, m.index))) continue;
    out.push(m[0]);
  }
  return out;
}

Deno.test("the spread finder tells calls from rest parameters and literals", () => {
  assert.equal(callSpreads("const m = Math.max(...values);").length, 1);
  assert.equal(callSpreads('out.push("", ...rows.map(f));').length, 1);
  assert.equal(
    callSpreads("const push = (kind: string) => (...args: readonly unknown[]) => {").length,
    0,
  );
  assert.equal(callSpreads("function f(...xs) {").length, 0);
  assert.equal(callSpreads("Object.freeze({ ...bundle });").length, 0);
  assert.equal(callSpreads("g([min, ...edges]);").length, 0);
  assert.equal(callSpreads("const s = _span(...r.ranks);").length, 0);
  assert.equal(callSpreads("lo = Math.min(...v);").length, 1);
  assert.equal(callSpreads("const c = String.fromCharCode(...bytes);").length, 1);
});

Deno.test("no argument spread in lib/", async () => {
  const found: string[] = [];
  for (const url of await files(LIB)) {
    const code = (await Deno.readTextFile(url))
      .replace(/\/\*[\s\S]*?\*\//g, (c) => c.replace(/[^\n]/g, " "))
      .replace(/\/\/.*$/gm, "");
    code.split("\n").forEach((line, i) => {
      if (callSpreads(line).length > 0) {
        found.push(`${url.pathname.replace(/^.*\/lib\//, "lib/")}:${i + 1}: ${line.trim()}`);
      }
    });
  }
  assert.deepEqual(found, [], `argument spreads:\n${found.join("\n")}`);
});
