// `.by(column).stakes()`: each group's figures are the one-variable figures of
// that group's values; the chain's re-expression is used in every group;
// groups too small or constant say why; display, exports and save.
import { deepEqual, equal, match, ok, rejects, throws } from "node:assert/strict";
import { PlumbError } from "../../lib/errors.ts";
import { seededRandom } from "../../lib/numeric/random.ts";
import { plumb } from "../../lib/plumb/plumb.ts";
import { DISPLAY } from "../../lib/results/display.ts";
import { stakes } from "../../lib/stakes/stakes.ts";

const rng = seededRandom(77);
// Invented: cap torque (N·m) on three filler lines, line C right-skewed; line D has two
// values and line E one repeated value.
const line: string[] = [];
const torque: number[] = [];
for (
  const [name, n, make] of [
    ["A", 60, () => 2.0 + 0.15 * rng.normal()],
    ["B", 45, () => 2.1 + 0.2 * rng.normal()],
    ["C", 50, () => Math.exp(0.6 + 0.3 * rng.normal())],
    ["D", 2, () => 2.0],
    ["E", 4, () => 1.9],
  ] as const
) {
  for (let i = 0; i < n; i++) {
    line.push(name);
    torque.push(make());
  }
}
const data = { line, torque };
const of = (g: string) => torque.filter((_, i) => line[i] === g);

Deno.test("stakes by group: each group's figures are the one-variable figures of its values", () => {
  const options = { lower: 1.5, upper: 2.6 };
  const view = plumb(data, "torque").by("line").stakes(options);
  const r = view.result();
  deepEqual(r.groups.map((g) => g.group), ["A", "B", "C", "D", "E"]);
  for (const g of ["A", "B", "C"]) {
    const row = r.groups.find((x) => x.group === g)!;
    deepEqual(row.stakes!.toJSON(), stakes(of(g), options).toJSON(), `line ${g}`);
  }
  match(r.groups[3].skipped!, /only 2 values/);
  equal(r.groups[4].skipped, "every value is the same");
  const json = view.toJSON() as { groups: Record<string, unknown>[] };
  ok("range" in json.groups[0] && "outside" in json.groups[0] && "mean" in json.groups[0]);
  deepEqual(json.groups[3], { group: "D", n: 2, skipped: r.groups[3].skipped });
});

Deno.test("stakes by group: after .reexpress(), that re-expression in every group", () => {
  const r = plumb(data, "torque").reexpress("log").by("line").stakes().result();
  for (const g of r.groups.filter((x) => x.stakes)) {
    equal(g.stakes!.reexpression?.label, "ln(x)", g.group);
    deepEqual(
      g.stakes!.toJSON(),
      stakes(of(g.group), { reexpression: g.stakes!.reexpression! }).toJSON(),
    );
  }
  throws(
    () => plumb(data, "torque").reexpress("log").by("line").stakes({ reexpression: "none" }),
    (e) => e instanceof PlumbError && e.code === "bad-option",
  );
  throws(
    () => plumb(data, "torque").by("line").stakes({ coverag: 0.9 } as never),
    (e) => e instanceof PlumbError && /did you mean "coverage"/.test(e.message),
  );
});

Deno.test("stakes by group: table, paragraphs with the caution once, CSV, display", async () => {
  const view = plumb(data, "torque").by("line").stakes({ lower: 1.5, upper: 2.6 });
  const t = view.table();
  equal(t.rows.length, 5);
  deepEqual(t.columns.map((c) => c.title).slice(0, 3), ["line", "n", "normal 95% range"]);
  const paras = view.paragraphs();
  equal(paras.length, 4);
  ok(paras[0].startsWith("line = A (n = 60): assuming a normal distribution"));
  equal(paras.filter((p) => p.includes("organisation's procedures")).length, 1);
  const csv = view.toCSV().split("\n");
  equal(csv[0], "group,quantity,way,value,lower,upper,verdict");
  ok(csv.some((l) => l.startsWith("C,Cpk,normal,")));
  const b = await view[DISPLAY]();
  match(b["text/html"]!, /<table[\s\S]*(<svg|<img)/);
  match(b["text/plain"], /organisation's procedures/);
  const dir = await Deno.makeTempDir();
  try {
    const saved = await view.save(`${dir}/by_line.json`);
    deepEqual(
      JSON.parse(await Deno.readTextFile(saved.path)),
      JSON.parse(JSON.stringify(view.toJSON())),
    );
  } finally {
    await Deno.remove(dir, { recursive: true });
  }
});

Deno.test("stakes by group: many groups stay within 300 KB, saying what is left out", async () => {
  const r = seededRandom(5);
  const g: string[] = [];
  const v: number[] = [];
  for (let i = 0; i < 300; i++) {
    // Every tenth group is strongly skewed, so that the difference matters there.
    const skewed = i % 10 === 3;
    for (let j = 0; j < 8; j++) {
      g.push(`G${i}`);
      v.push(skewed ? Math.exp(2 * r.normal()) : 10 + r.normal());
    }
  }
  const view = plumb({ g, v }, "v").by("g").stakes({ reexpression: "none" });
  const b = await view[DISPLAY]();
  const bytes = Object.values(b).reduce(
    (a, t) => a + new TextEncoder().encode(typeof t === "string" ? t : JSON.stringify(t)).length,
    0,
  );
  ok(bytes <= 300_000, `${bytes} bytes`);
  match(b["text/plain"], /40 of 300 groups shown, those where the difference matters first/);
  match(b["text/plain"], /cover 8 of 300 groups/);
  equal(view.table().rows.length, 300, "table() holds every group");
  equal(view.paragraphs().length, 301);
  equal(view.toCSV().split("\n").filter((l) => l.startsWith("G299,")).length > 0, true);
  // The groups shown first are those where the difference matters.
  const matters = view.result().groups.filter((x) => x.stakes?.judgement.overall === "matters");
  ok(matters.length > 0 && matters.length <= 40);
  for (const m of matters) ok(b["text/plain"].includes(`\n${m.group} `), m.group);
});

Deno.test("stakes by group: with no group to draw, a picture is refused and the table still saves", async () => {
  const view = plumb({ g: ["a", "a", "b", "b"], v: [1, 2, 3, 4] }, "v").by("g").stakes();
  const dir = await Deno.makeTempDir();
  try {
    await rejects(
      view.save(`${dir}/none.svg`),
      (e) =>
        e instanceof PlumbError && e.code === "too-few" &&
        /save as \.csv or \.json/.test(e.message),
    );
    const saved = await view.save(`${dir}/none.md`);
    match(await Deno.readTextFile(saved.path), /not computed: only 2 values/);
  } finally {
    await Deno.remove(dir, { recursive: true });
  }
});
