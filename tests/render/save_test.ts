import assert from "node:assert/strict";
import { PlumbError } from "../../lib/errors.ts";
import { saveDisplay, saveFormats, type SaveSource, staticPage } from "../../lib/render/save.ts";

const bundle = {
  "text/plain": "fill (mL): n = 12",
  "text/markdown": "**fill (mL)**: n = 12",
  "text/html": "<p><strong>fill (mL)</strong>: n = 12</p>",
};
const full: SaveSource = {
  what: "the summary of fill (mL)",
  bundle: () => bundle,
  json: () => ({ n: 12, name: "fill (mL)" }),
  csv: () => "name,n\nfill (mL),12\n",
  svg: () => '<svg xmlns="http://www.w3.org/2000/svg" width="2" height="2"/>',
  png: () => new Uint8Array([0x89, 0x50, 0x4e, 0x47]),
};

async function inTemp<T>(f: (dir: string) => Promise<T>): Promise<T> {
  const dir = await Deno.makeTempDir({ prefix: "plumbline_save_test_" });
  try {
    return await f(dir);
  } finally {
    await Deno.remove(dir, { recursive: true });
  }
}

async function rejectsWith(p: Promise<unknown>, code: string, message: RegExp) {
  await assert.rejects(p, (e: unknown) => {
    assert.ok(e instanceof PlumbError, `expected a PlumbError, got ${e}`);
    assert.equal(e.code, code);
    assert.match(e.message, message);
    return true;
  });
}

Deno.test("saveDisplay writes each format from its own writer, type by extension", async () => {
  await inTemp(async (dir) => {
    const expected: Record<string, string> = {
      "a.md": "**fill (mL)**: n = 12\n",
      "a.MARKDOWN": "**fill (mL)**: n = 12\n",
      "a.txt": "fill (mL): n = 12\n",
      "a.csv": "name,n\nfill (mL),12\n",
      "a.json": '{\n  "n": 12,\n  "name": "fill (mL)"\n}\n',
      "a.svg": '<svg xmlns="http://www.w3.org/2000/svg" width="2" height="2"/>',
    };
    for (const [name, text] of Object.entries(expected)) {
      const saved = await saveDisplay(`${dir}/${name}`, full);
      assert.equal(await Deno.readTextFile(`${dir}/${name}`), text, name);
      assert.equal(saved.bytes, new TextEncoder().encode(text).length);
      assert.ok(Object.isFrozen(saved));
    }
    const png = await saveDisplay(`${dir}/a.png`, full);
    assert.deepEqual(png.toJSON(), { path: `${dir}/a.png`, format: "png", bytes: 4 });
    assert.equal(String(png), `Saved ${dir}/a.png (png, 4 bytes)`);
    assert.deepEqual([...await Deno.readFile(`${dir}/a.png`)], [0x89, 0x50, 0x4e, 0x47]);
  });
});

Deno.test("a saved .html page is static and self-contained: no scripts, no remote loads", async () => {
  await inTemp(async (dir) => {
    const hostile: SaveSource = {
      what: "a <script>alert(1)</script> title",
      bundle: () => ({ "text/plain": "x", "text/html": "<p>body</p>" }),
    };
    await saveDisplay(`${dir}/page.HTM`, hostile);
    const page = await Deno.readTextFile(`${dir}/page.HTM`);
    assert.ok(page.startsWith("<!DOCTYPE html>"));
    assert.match(page, /<meta charset="utf-8">/);
    assert.match(page, /<title>a &lt;script&gt;alert\(1\)&lt;\/script&gt; title<\/title>/);
    assert.ok(page.includes("<p>body</p>"));
    assert.doesNotMatch(page, /<script|<link|\bsrc="(?!data:)|@import|url\(/i);
    // Without HTML in the bundle the plain text is shown, escaped.
    await saveDisplay(`${dir}/plain.html`, {
      what: "t",
      bundle: () => ({ "text/plain": "a < b" }),
    });
    assert.ok((await Deno.readTextFile(`${dir}/plain.html`)).includes("<pre>a &lt; b</pre>"));
  });
});

Deno.test("saveDisplay refuses an unsupported extension, naming the ones that work", async () => {
  const tableOnly: SaveSource = { what: "the tests table", bundle: () => bundle, csv: () => "" };
  assert.deepEqual(saveFormats(tableOnly), ["html", "md", "txt", "csv"]);
  await rejectsWith(
    saveDisplay("tests.png", tableOnly),
    "unsupported-format",
    /^Cannot save the tests table as "\.png": the file type follows the extension, and this display saves as \.html, \.md, \.txt or \.csv: change the extension$/,
  );
  await rejectsWith(
    saveDisplay("tests.xlsx", full),
    "unsupported-format",
    /as "\.xlsx": .* saves as \.svg, \.png, \.html, \.md, \.txt, \.csv or \.json/,
  );
  await rejectsWith(
    saveDisplay("chart", full),
    "unsupported-format",
    /^Cannot save the summary of fill \(mL\) as a path without an extension/,
  );
  await rejectsWith(saveDisplay("", full), "bad-option", /give a file path such as "chart\.png"/);
});

Deno.test("saveDisplay says when the folder does not exist", async () => {
  await inTemp(async (dir) => {
    await rejectsWith(
      saveDisplay(`${dir}/no/such/folder/a.md`, full),
      "not-found",
      /^Cannot save to .*\/no\/such\/folder\/a\.md: its folder does not exist: create the folder first$/,
    );
  });
});

Deno.test("staticPage escapes the title and keeps the body", () => {
  const page = staticPage('"q" & <r>', "<div>ok</div>");
  assert.ok(page.includes("<title>&quot;q&quot; &amp; &lt;r&gt;</title>"), page);
  assert.ok(page.includes("\n<div>ok</div>\n"));
});
