import assert from "node:assert/strict";
import { escapeHtml, escapeMarkdown, plainText } from "../../lib/render/escape.ts";

Deno.test("escapeHtml escapes the five markup characters and control characters", () => {
  assert.equal(
    escapeHtml(`<a href="x" title='y'>&amp;</a>`),
    "&lt;a href=&quot;x&quot; title=&#39;y&#39;&gt;&amp;amp;&lt;/a&gt;",
  );
  assert.equal(escapeHtml("bell\u0007 tab\t nl\n"), "bell\ufffd tab\t nl\n");
  assert.equal(escapeHtml("🍾 µ ±"), "🍾 µ ±");
});

Deno.test("plainText strips ANSI sequences and control characters", () => {
  assert.equal(plainText("\u001b[1;31mbold red\u001b[0m"), "bold red");
  assert.equal(plainText("\u001b]8;;http://x\u0007link\u001b]8;;\u0007"), "link");
  assert.equal(plainText("a\tb\u0000c\nd"), "a b\ufffdc\nd");
});

Deno.test("escapeMarkdown escapes Markdown and HTML and flattens line breaks", () => {
  assert.equal(
    escapeMarkdown("*a* _b_ `c` [d](e) #f |g| <h> &i"),
    "\\*a\\* \\_b\\_ \\`c\\` \\[d\\](e) #f \\|g\\| &lt;h&gt; &amp;i",
  );
  assert.equal(escapeMarkdown("one\ntwo\r\nthree"), "one two three");
  // Line-start markers are escaped only where they would act: at the start.
  assert.equal(escapeMarkdown("1. x - y + z!"), "1\\. x - y + z!");
  assert.equal(escapeMarkdown("- item"), "\\- item");
  assert.equal(escapeMarkdown("# heading"), "\\# heading");
  assert.equal(escapeMarkdown("+ 1"), "\\+ 1");
  assert.equal(escapeMarkdown("0.25 and −1.5 (n = 3)"), "0.25 and −1.5 (n = 3)");
});
