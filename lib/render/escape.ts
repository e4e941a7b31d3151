/**
 * Escaping for every string that reaches a display: HTML and SVG text and
 * attributes, Markdown table cells and plain text.
 *
 * @module
 */

const _HTML: Readonly<Record<string, string>> = {
  "&": "&amp;",
  "<": "&lt;",
  ">": "&gt;",
  '"': "&quot;",
  "'": "&#39;",
};

/**
 * Escape text for HTML or SVG element content and quoted attribute values.
 * Also replaces the characters XML 1.0 forbids (C0 controls other than tab,
 * newline and carriage return; DEL; U+FFFE, U+FFFF; unpaired surrogates)
 * with U+FFFD.
 *
 * @param s any string
 * @example
 * ```ts
 * import { escapeHtml } from "./escape.ts";
 * if (escapeHtml(`<b a="1">&'`) !== "&lt;b a=&quot;1&quot;&gt;&amp;&#39;") throw new Error("html");
 * ```
 */
export function escapeHtml(s: string): string {
  return _xmlChars(String(s).replace(/[&<>"']/g, (c) => _HTML[c]));
}

/**
 * Replace the characters XML 1.0 forbids (C0 controls other than tab,
 * newline and carriage return; DEL, which XML allows but HTML calls a parse
 * error; U+FFFE, U+FFFF; unpaired surrogates) with U+FFFD. Private to
 * `lib/render`: markup from elsewhere (vega's SVG) passes through it too.
 */
export function _xmlChars(s: string): string {
  return s
    // deno-lint-ignore no-control-regex
    .replace(/[\u0000-\u0008\u000b\u000c\u000e-\u001f\u007f\ufffe\uffff]/g, "\ufffd")
    .replace(/[\ud800-\udbff](?![\udc00-\udfff])|(?<![\ud800-\udbff])[\udc00-\udfff]/g, "\ufffd");
}

/**
 * Make a string safe as plain text output: removes ANSI escape sequences
 * and replaces other control characters (except newline) with U+FFFD, and
 * tabs with a space.
 *
 * @param s any string
 * @example
 * ```ts
 * import { plainText } from "./escape.ts";
 * if (plainText("\u001b[31mred\u001b[0m\tok") !== "red ok") throw new Error("ansi");
 * ```
 */
export function plainText(s: string): string {
  return String(s)
    // deno-lint-ignore no-control-regex
    .replace(/\u001b\[[0-9;?]*[ -\/]*[@-~]/g, "")
    // deno-lint-ignore no-control-regex
    .replace(/\u001b\][^\u0007\u001b]*(\u0007|\u001b\\)?/g, "")
    .replace(/\t/g, " ")
    // deno-lint-ignore no-control-regex
    .replace(/[\u0000-\u0009\u000b-\u001f\u007f]/g, "\ufffd");
}

/**
 * Escape text for one line of Markdown (a heading, a list item or a table
 * cell): the characters that start emphasis, code, links and table cells
 * anywhere in a line are backslash-escaped; the line-start markers (`#`,
 * `-`, `+`, `>`, `1.`) are escaped only at the start, so numbers like
 * `0.25` and `−1.5` stay readable; `<` and `&` become entities (Markdown
 * passes HTML through), and line breaks become spaces.
 *
 * @param s any string
 * @example
 * ```ts
 * import { escapeMarkdown } from "./escape.ts";
 * if (escapeMarkdown("a|b *c* <i>") !== "a\\|b \\*c\\* &lt;i&gt;") throw new Error("md");
 * ```
 */
export function escapeMarkdown(s: string): string {
  return plainText(String(s).replace(/\r?\n|\r/g, " "))
    .replace(/&/g, "&amp;")
    .replace(/</g, "&lt;")
    .replace(/>/g, "&gt;")
    .replace(/[\\`*_\[\]|~]/g, (c) => "\\" + c)
    .replace(/^(\s*)([#+\-])/, "$1\\$2")
    .replace(/^(\s*\d+)([.)])(?=\s|$)/, "$1\\$2");
}

/**
 * A tooltip title as Vega-Lite needs it: it writes tooltip titles into an
 * expression string, escaping quotes but nothing else, so a name ending in
 * `\` or holding a line end (`\n`, `\r`, U+2028, U+2029: a wrapped
 * spreadsheet header) broke the expression. Escaped, they read back as the
 * characters they stand for.
 */
export function _tooltipTitle(title: string): string {
  return title.replace(/[\\\n\r\u2028\u2029]/g, (c) => _EXPRESSION_ESCAPES[c]);
}

const _EXPRESSION_ESCAPES: Readonly<Record<string, string>> = {
  "\\": "\\\\",
  "\n": "\\n",
  "\r": "\\r",
  "\u2028": "\\u2028",
  "\u2029": "\\u2029",
};
