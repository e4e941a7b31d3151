/**
 * A chart that cannot be drawn for a valid sample shows why instead: a
 * Vega-Lite spec of one panel holding the explanation as wrapped lines of
 * text, so that a display (and a report around it) never fails.
 *
 * @module
 */
import type { TopLevelSpec } from "../_deps/vega_lite.ts";
import { VEGALITE_SCHEMA } from "./qq_spec.ts";
import { textWidth } from "./text_width.ts";
import { CHART_CONFIG, PALETTE, PANEL } from "./theme.ts";

const _SIZE = 12;
const _WIDTH = 2 * PANEL.width;

/** Words of `text` as lines no wider than `width` pixels at the note's font size. */
function _lines(text: string, width: number): string[] {
  const lines: string[] = [];
  let line = "";
  for (const word of text.split(/\s+/).filter((w) => w.length > 0)) {
    const next = line ? `${line} ${word}` : word;
    if (line && textWidth(next, _SIZE) > width) {
      lines.push(line);
      line = word;
    } else line = next;
  }
  if (line) lines.push(line);
  return lines;
}

/**
 * A chart-sized note in place of a chart that cannot be drawn.
 *
 * @param title the chart's title (what would have been drawn)
 * @param note why it is not drawn and what to do, as a sentence
 *
 * @example
 * ```ts
 * import { noteSpec } from "./note_spec.ts";
 * const spec = noteSpec("mass: λ explorer", "Not drawn: the values vary too little");
 * if (!JSON.stringify(spec).includes("vary too little")) throw new Error("note");
 * ```
 */
export function noteSpec(title: string, note: string): TopLevelSpec {
  const lines = _lines(note, _WIDTH - 20);
  return {
    $schema: VEGALITE_SCHEMA,
    description: `${title}: ${note}`,
    title: { text: title },
    config: CHART_CONFIG,
    width: _WIDTH,
    height: Math.max(60, 22 * lines.length + 20),
    data: { values: lines.map((t, i) => ({ i, t })) },
    mark: { type: "text", align: "left", baseline: "top", fontSize: _SIZE, color: PALETTE.line },
    encoding: {
      x: { value: 10 },
      y: { field: "i", type: "ordinal", axis: null },
      text: { field: "t", type: "nominal" },
    },
  } as TopLevelSpec;
}
