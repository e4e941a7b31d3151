/**
 * The note a per-group table carries when group labels that differ only in
 * spaces were merged into one group.
 *
 * @module
 */
import type { MergedLabel } from "../data/table.ts";

/**
 * The note for labels merged because they differ only in spaces, with each
 * spelling shown so that its spaces can be seen (`"A\u00a0"`).
 *
 * @example
 * ```ts
 * import { mergedLabelsNote } from "./merged_labels_note.ts";
 * const note = mergedLabelsNote("line", [{ label: "A", spellings: ["A", " A", "A\u00a0"] }]);
 * if (note !== 'Labels of line that differ only in spaces were merged: "A" (written "A", " A", "A\\u00a0").') {
 *   throw new Error(note);
 * }
 * ```
 */
export function mergedLabelsNote(by: string, merged: readonly MergedLabel[]): string {
  const visible = (s: string) =>
    JSON.stringify(s).replace(
      /[\u0080-\uffff]/g,
      (c) => /\s|\u200b|\u180e/.test(c) ? `\\u${c.charCodeAt(0).toString(16).padStart(4, "0")}` : c,
    );
  const shown = merged.slice(0, 5).map((m) =>
    `${visible(m.label)} (written ${m.spellings.map(visible).join(", ")})`
  );
  const more = merged.length > 5 ? ` and ${merged.length - 5} more labels` : "";
  return `Labels of ${by} that differ only in spaces were merged: ${shown.join("; ")}${more}.`;
}
