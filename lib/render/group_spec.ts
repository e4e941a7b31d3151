/**
 * Vega-Lite spec of QQ plots by group: one panel per group on shared axes,
 * so groups can be compared in level and spread as well as in shape.
 *
 * @module
 */
import type { TopLevelSpec } from "../_deps/vega_lite.ts";
import type { QqData } from "../stats/qq_data.ts";
import { _defaultPerPanel, _gridCheck } from "./comparison_spec.ts";
import { formatCentre, formatCount, formatNumber } from "../results/format.ts";
import { _qqPanel } from "./qq_panel.ts";
import { VEGALITE_SCHEMA } from "./qq_spec.ts";
import { CHART_CONFIG, PANEL } from "./theme.ts";

/** One group's QQ data. */
export interface GroupPanel {
  /** The group's value (label), shown as typed. */
  readonly group: string;
  /** The QQ data of the group's values. */
  readonly qq: QqData;
}

/** Options for {@linkcode groupSpec}. */
export interface GroupSpecOptions {
  /**
   * The variable's name.
   * @default "value"
   */
  readonly name?: string;
  /**
   * The grouping column's name.
   * @default "group"
   */
  readonly by?: string;
  /**
   * Panels per row.
   * @default 3
   */
  readonly columns?: number;
  /**
   * Most points drawn per panel.
   * @default 800 divided by the number of panels, between 60 and 250
   */
  readonly pointsPerPanel?: number;
}

/**
 * QQ plots of one variable by group, on shared axes.
 *
 * @param groups the groups, in the order to show them
 * @param options names, layout, points per panel
 * @example
 * ```ts
 * import { qqData } from "@plumbline/plumbline";
 * import { groupSpec } from "./group_spec.ts";
 * const spec = groupSpec([
 *   { group: "line A", qq: qqData([500.2, 499.8, 500.5, 500.1, 499.6]) },
 *   { group: "line B", qq: qqData([501.0, 500.4, 501.3, 500.9, 500.2]) },
 * ], { name: "fill (mL)", by: "filler" });
 * if (!JSON.stringify(spec).includes("line B")) throw new Error("group");
 * ```
 */
export function groupSpec(
  groups: readonly GroupPanel[],
  options: GroupSpecOptions = {},
): TopLevelSpec {
  _gridCheck(groups.length, "QQ plots by group");
  const name = options.name ?? "value";
  const by = options.by ?? "group";
  const columns = options.columns ?? 3;
  const per = options.pointsPerPanel ?? _defaultPerPanel(groups.length);
  const panels = groups.map((g) =>
    _qqPanel(g.qq, {
      name,
      title: g.group,
      subtitle: [
        `n = ${formatCount(g.qq.n)} · mean ${formatCentre(g.qq.mean, g.qq.sd)} · sd ${
          formatNumber(g.qq.sd)
        }`,
        `${formatCount(g.qq.outsideCount)} of ${formatCount(g.qq.shown)} shown outside band`,
      ],
      width: PANEL.small,
      height: PANEL.small - 30,
      maxPoints: per,
    })
  );
  const list = groups.map((g) => `${g.group}: n = ${g.qq.n}, ${g.qq.outsideCount} outside`).join(
    "; ",
  );
  return {
    $schema: VEGALITE_SCHEMA,
    description:
      `Normal QQ plots of ${name} for each ${by} (${groups.length} groups) on shared axes, ` +
      `each with its own fitted line and ${groups[0].qq.envelope} ${
        groups[0].qq.level * 100
      }% envelope. ${list}.`,
    title: { text: name, subtitle: `normal QQ plots by ${by} · shared axes` },
    config: CHART_CONFIG,
    columns: Math.min(columns, groups.length),
    concat: panels,
    resolve: { scale: { x: "shared", y: "shared" } },
  } as TopLevelSpec;
}
