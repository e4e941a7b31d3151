/**
 * Saving a chain's card: its text formats from its display and data, its two
 * charts (QQ plot, histogram) side by side as one SVG or PNG.
 *
 * @module
 */
import { cardSpecs } from "../render/card.ts";
import { specSvg } from "../render/chart_bundle.ts";
import { savable, type SavedFile, saveDisplay } from "../render/save.ts";
import type { Analysis } from "../results/analysis.ts";
import type { Displayable } from "../results/display.ts";

/**
 * Save a chain's card: `.html`, `.md`, `.txt`, `.json` (the analysis), `.svg`
 * or `.png` (its QQ plot and histogram side by side).
 *
 * @param path where to write; the type follows the extension
 * @param chain the chain whose card it is
 */
export function saveCard(
  path: string,
  chain: Displayable & { toJSON(): unknown; analysis(): Analysis; readonly label: string },
): Promise<SavedFile> {
  const charts = () => {
    const specs = cardSpecs(chain.analysis(), chain.label);
    return Promise.all([specSvg(specs.qq), specSvg(specs.histogram)]);
  };
  return saveDisplay(path, savable(chain, `the card of ${chain.label}`, { charts }));
}
