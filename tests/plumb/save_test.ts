/**
 * Every displayable of the chain saves to a file whose type follows the
 * extension, and refuses an extension it cannot write with a PlumbError
 * that lists the ones it can.
 */
import assert from "node:assert/strict";
import { PlumbError } from "../../lib/errors.ts";
import { plumb, survey } from "../../mod.ts";

const PNG_SIGNATURE = [0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a];

function skewed(n: number): number[] {
  // Deterministic right-skewed values (exponential quantiles).
  return Array.from({ length: n }, (_, i) => 10 + 3 * -Math.log(1 - (i + 0.5) / n));
}

const table = {
  line: Array.from({ length: 60 }, (_, i) => ["A", "B", "C"][i % 3]),
  fill_ml: Array.from({ length: 60 }, (_, i) => 500 + Math.sin(i * 1.7) * 2 + (i % 3) * 0.4),
  gap_min: skewed(60),
};

async function inTemp(f: (dir: string) => Promise<void>): Promise<void> {
  const dir = await Deno.makeTempDir({ prefix: "plumbline_save_all_" });
  try {
    await f(dir);
  } finally {
    await Deno.remove(dir, { recursive: true });
  }
}

async function assertPng(path: string): Promise<void> {
  const bytes = await Deno.readFile(path);
  assert.deepEqual([...bytes.subarray(0, 8)], PNG_SIGNATURE, `${path} is a PNG`);
  const view = new DataView(bytes.buffer, bytes.byteOffset);
  assert.ok(view.getUint32(16) > 100 && view.getUint32(20) > 100, `${path} has a chart's size`);
}

async function assertSvg(path: string, ...texts: string[]): Promise<void> {
  const svg = await Deno.readTextFile(path);
  assert.match(svg, /^<svg [^>]*xmlns="http:\/\/www\.w3\.org\/2000\/svg"[^>]*width="\d/);
  assert.ok(svg.trimEnd().endsWith("</svg>"));
  for (const t of texts) assert.ok(svg.includes(t), `${path} holds ${t}`);
}

async function assertStaticHtml(path: string, ...texts: string[]): Promise<void> {
  const html = await Deno.readTextFile(path);
  assert.ok(html.startsWith("<!DOCTYPE html>"));
  assert.doesNotMatch(html, /<script|<link|\bsrc="(?!data:)|@import|url\(http/i);
  for (const t of texts) assert.ok(html.includes(t), `${path} holds ${t}`);
}

Deno.test("a chart saves as SVG, PNG, static HTML and its spec as JSON", async () => {
  await inTemp(async (dir) => {
    const p = plumb(table, "gap_min");
    for (
      const [name, c] of [["qq", p.qq()], ["hist", p.histogram()], ["lambda", p.lambda()]] as const
    ) {
      await c.save(`${dir}/${name}.svg`);
      await assertSvg(`${dir}/${name}.svg`, "gap_min");
      await c.save(`${dir}/${name}.png`);
      await assertPng(`${dir}/${name}.png`);
      await c.save(`${dir}/${name}.html`);
      await assertStaticHtml(`${dir}/${name}.html`, "<svg");
      const saved = await c.save(`${dir}/${name}.json`);
      assert.equal(saved.format, "json");
      assert.deepEqual(
        JSON.parse(await Deno.readTextFile(`${dir}/${name}.json`)),
        JSON.parse(JSON.stringify(c.spec)),
      );
    }
  });
});

Deno.test("the card, groups and candidates save their charts together and their text", async () => {
  await inTemp(async (dir) => {
    const p = plumb(table, "gap_min");
    await p.save(`${dir}/card.png`);
    await assertPng(`${dir}/card.png`);
    await p.save(`${dir}/card.svg`);
    // Two charts in one document, their ids kept apart.
    const svg = await Deno.readTextFile(`${dir}/card.svg`);
    assert.equal(svg.match(/<svg\b/g)?.length, 3);
    const ids = [...svg.matchAll(/\bid="([^"]+)"/g)].map((m) => m[1]);
    assert.equal(new Set(ids).size, ids.length, "ids are unique");
    await p.save(`${dir}/card.html`);
    await assertStaticHtml(`${dir}/card.html`, "gap_min", 'src="data:image/png;base64,');
    await p.save(`${dir}/card.json`);
    assert.equal(JSON.parse(await Deno.readTextFile(`${dir}/card.json`)).n, 60);
    await p.save(`${dir}/card.md`);
    assert.ok((await Deno.readTextFile(`${dir}/card.md`)).startsWith("### gap\\_min"));

    const g = plumb(table, "fill_ml").by("line");
    await g.save(`${dir}/groups.csv`);
    assert.equal(await Deno.readTextFile(`${dir}/groups.csv`), g.toCSV());
    await g.save(`${dir}/groups.png`);
    await assertPng(`${dir}/groups.png`);
    await g.save(`${dir}/groups.html`);
    await assertStaticHtml(`${dir}/groups.html`, "fill_ml by line");
    await g.sentences().save(`${dir}/groups.md`);
    assert.equal(
      (await Deno.readTextFile(`${dir}/groups.md`)).split("\n").filter((l) => l.startsWith("- "))
        .length,
      g.sentences().texts.length,
    );

    const c = p.candidates();
    await c.save(`${dir}/candidates.csv`);
    assert.equal(await Deno.readTextFile(`${dir}/candidates.csv`), c.toCSV());
    await c.save(`${dir}/candidates.svg`);
    await assertSvg(`${dir}/candidates.svg`);
  });
});

Deno.test("tables and sentences save as text formats; survey as CSV and HTML", async () => {
  await inTemp(async (dir) => {
    const p = plumb(table, "fill_ml");
    await p.tests().save(`${dir}/tests.csv`);
    assert.equal(await Deno.readTextFile(`${dir}/tests.csv`), p.tests().toCSV());
    await p.tests().save(`${dir}/tests.md`);
    assert.equal(await Deno.readTextFile(`${dir}/tests.md`), p.tests().toMarkdown() + "\n");
    await p.sentence().save(`${dir}/sentence.txt`);
    assert.equal(await Deno.readTextFile(`${dir}/sentence.txt`), p.sentence().text + "\n");
    const s = survey(table);
    await s.save(`${dir}/survey.csv`);
    assert.equal(await Deno.readTextFile(`${dir}/survey.csv`), s.toCSV());
    await s.save(`${dir}/survey.html`);
    await assertStaticHtml(`${dir}/survey.html`, "gap_min", "fill_ml");
  });
});

Deno.test("an extension a display cannot write is refused, naming those it can", async () => {
  const p = plumb(table, "fill_ml");
  const cases: [Promise<unknown>, RegExp][] = [
    [p.qq().save("qq.jpg"), /as "\.jpg".*saves as \.svg, \.png, \.html, \.md, \.txt or \.json/],
    [p.sentence().save("s.png"), /as "\.png".*saves as \.html, \.md, \.txt or \.json/],
    [survey(table).save("survey.svg"), /\.csv or \.json: change the extension \(for a column/],
    [p.save("card"), /as a path without an extension/],
  ];
  for (const [promise, message] of cases) {
    await assert.rejects(promise, (e: unknown) => {
      assert.ok(e instanceof PlumbError);
      assert.equal(e.code, "unsupported-format");
      assert.match(e.message, message);
      return true;
    });
  }
});
