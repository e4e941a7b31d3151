/**
 * The write-up of a per-group screening: one paragraph per group and one for
 * the pooled residuals, shown as a list.
 *
 * @module
 */
import { escapeHtml, escapeMarkdown, plainText } from "../render/escape.ts";
import type { SavedFile } from "../render/save.ts";
import type { Displayable, MimeBundle } from "../results/display.ts";

/** The write-up of each group and of the pooled residuals. */
export interface GroupSentences extends Displayable {
  /** Every paragraph: one per group screened, then the pooled residuals'. */
  readonly texts: readonly string[];
  /** Every paragraph. */
  toJSON(): readonly string[];
  /** Write every paragraph to a file: `.md`, `.txt`, `.html` or `.json`, by extension. */
  save(path: string): Promise<SavedFile>;
}

/**
 * Paragraphs as a bulleted list (HTML, Markdown, text), after an optional note.
 *
 * @param texts the paragraphs
 * @param note a note shown first (what was left out)
 * @example
 * ```ts
 * import { listBundle } from "./group_sentences.ts";
 * if (listBundle(["a < b."])["text/markdown"] !== "- a &lt; b.") throw new Error("md");
 * ```
 */
export function listBundle(texts: readonly string[], note?: string): MimeBundle {
  const head = note ? [note] : [];
  return Object.freeze({
    "text/html": `<div style="max-width:860px">${
      head.map((t) => `<p style="font-size:90%">${escapeHtml(t)}</p>`).join("")
    }<ul>${texts.map((t) => `<li style="margin:4px 0">${escapeHtml(t)}</li>`).join("")}</ul></div>`,
    "text/markdown": [
      ...head.map(escapeMarkdown),
      texts.map((t) => `- ${escapeMarkdown(t)}`)
        .join("\n"),
    ].join("\n\n"),
    "text/plain": plainText([...head, texts.map((t) => `• ${t}`).join("\n")].join("\n\n")),
  });
}
