/**
 * Vega-Lite spec of a panel of QQ plots side by side, one per re-expression
 * candidate, each titled with its label and its W and p; for choosing a
 * re-expression by eye as well as by number.
 *
 * @module
 */
import type { TopLevelSpec } from "../_deps/vega_lite.ts";
import { PlumbError } from "../errors.ts";
import type { QqData } from "../stats/qq_data.ts";
import { formatCount, formatNumber, formatPClause } from "../results/format.ts";
import { _qqPanel } from "./qq_panel.ts";
import { VEGALITE_SCHEMA } from "./qq_spec.ts";
import { CHART_CONFIG, PANEL } from "./theme.ts";

/** One candidate re-expression. */
export interface ComparisonCandidate {
  /** What the candidate is, e.g. "log(x)" or "Box–Cox λ = 0.25". */
  readonly label: string;
  /** The QQ data of the re-expressed values. */
  readonly qq: QqData;
  /** Shapiro–Wilk W (or another statistic named by `statistic`). */
  readonly W: number;
  /** Its p-value. */
  readonly p: number;
  /** An optional short note shown under the title, e.g. "chosen". */
  readonly note?: string;
}

/** Options for {@linkcode comparisonSpec}. */
export interface ComparisonOptions {
  /**
   * The variable's name, in the chart title.
   * @default "value"
   */
  readonly name?: string;
  /**
   * Panels per row.
   * @default 3
   */
  readonly columns?: number;
  /**
   * The statistic's symbol in the panel titles.
   * @default "W"
   */
  readonly statistic?: string;
  /**
   * Most points drawn per panel.
   * @default 800 divided by the number of panels, between 60 and 250
   */
  readonly pointsPerPanel?: number;
}

/** Points per panel so that a grid stays near 800 points in all. */
export function _defaultPerPanel(count: number): number {
  return Math.max(60, Math.min(250, Math.floor(800 / count)));
}

/** Check the number of panels of a grid (shared with the group facets). */
export function _gridCheck(count: number, what: string): void {
  if (count < 1) {
    throw new PlumbError("too-few", `Cannot draw ${what} with no panels: pass at least one`);
  }
  if (count > 24) {
    throw new PlumbError(
      "too-many",
      `Cannot draw ${what} with ${count} panels: at most 24 stay readable; draw them in parts`,
      { count, max: 24 },
    );
  }
}

/**
 * Side-by-side QQ plots of re-expression candidates with their W and p.
 *
 * @param candidates the candidates, in the order to show them
 * @param options name, layout, statistic symbol, points per panel
 * @example
 * ```ts
 * import { qqData } from "@plumbline/plumbline";
 * import { comparisonSpec } from "./comparison_spec.ts";
 * const x = [1.2, 1.9, 2.4, 3.1, 4.8, 7.5, 12.0];
 * const spec = comparisonSpec([
 *   { label: "x", qq: qqData(x), W: 0.84, p: 0.1 },
 *   { label: "log x", qq: qqData(x.map(Math.log)), W: 0.98, p: 0.96 },
 * ]);
 * if (!JSON.stringify(spec).includes("log x")) throw new Error("label");
 * ```
 */
export function comparisonSpec(
  candidates: readonly ComparisonCandidate[],
  options: ComparisonOptions = {},
): TopLevelSpec {
  _gridCheck(candidates.length, "a re-expression panel");
  const name = options.name ?? "value";
  const stat = options.statistic ?? "W";
  const columns = options.columns ?? 3;
  const per = options.pointsPerPanel ?? _defaultPerPanel(candidates.length);
  const panels = candidates.map((c) =>
    _qqPanel(c.qq, {
      // The panel title names the re-expression; a short axis title keeps the
      // panels aligned (a long rotated title would stretch its row).
      name: "value on this scale",
      title: c.label,
      subtitle: [
        `${stat} = ${formatNumber(c.W, 4)} · ${formatPClause(c.p)}` +
        (c.note ? ` · ${c.note}` : ""),
        `n = ${formatCount(c.qq.n)} · ${formatCount(c.qq.outsideCount)} outside band`,
      ],
      width: PANEL.small,
      height: PANEL.small - 30,
      maxPoints: per,
    })
  );
  const list = candidates
    .map((c) => `${c.label}: ${stat} = ${formatNumber(c.W, 4)}, ${formatPClause(c.p)}`)
    .join("; ");
  return {
    $schema: VEGALITE_SCHEMA,
    description:
      `Normal QQ plots of ${candidates.length} re-expressions of ${name}, side by side, ` +
      `each with its fitted line and ${candidates[0].qq.envelope} ${
        candidates[0].qq.level * 100
      }% envelope. ` +
      `${list}.`,
    title: {
      text: name,
      subtitle: `re-expression candidates · normal QQ plots with ${stat} and p`,
    },
    config: CHART_CONFIG,
    columns: Math.min(columns, candidates.length),
    concat: panels,
  } as TopLevelSpec;
}
