/**
 * `.by()` over a query source: one screening per group by the engine, and
 * the pooled within-group residuals, shown and exported like the in-memory
 * per-group table.
 *
 * @module
 */
import { PlumbError } from "../errors.ts";
import { DISPLAY, type Displayable, type MimeBundle } from "../results/display.ts";
import type { QueryEngine, QueryTransform } from "../results/query_source.ts";
import { checkAdjustment } from "../stats/multiplicity.ts";
import type { QueryRequest } from "../results/query_source.ts";
import type { GroupOptions, GroupResult, GroupRow } from "./group_screen.ts";
import { groupResult } from "./_group_result.ts";
import { PlumbGroups } from "./groups.ts";
import type { PlumbOptions } from "./_chain_options.ts";

/**
 * One column of a query source screened within each group of another.
 * Create it with `plumb(scan(...), column).by(group)`.
 */
export class QueryGroups implements Displayable {
  readonly #engine: QueryEngine;
  readonly #column: () => Promise<{ column: string; transform?: QueryTransform }>;
  readonly #by: string;
  readonly #options: PlumbOptions;
  readonly #groupOptions: GroupOptions;
  #groups: Promise<PlumbGroups> | undefined;

  /** @internal Use `plumb(source, column).by(group)`. */
  constructor(
    engine: QueryEngine,
    column: () => Promise<{ column: string; transform?: QueryTransform }>,
    by: string,
    options: PlumbOptions,
    groupOptions: GroupOptions,
  ) {
    checkAdjustment(groupOptions.adjust);
    this.#engine = engine;
    this.#column = column;
    this.#by = by;
    this.#options = options;
    this.#groupOptions = groupOptions;
    Object.freeze(this);
  }

  /** The per-group screening, ready to show and export like the in-memory one. */
  groups(): Promise<PlumbGroups> {
    return (this.#groups ??= this.#run());
  }

  async #run(): Promise<PlumbGroups> {
    const [{ column, transform }, by] = [await this.#column(), this.#by];
    const label = transform?.label ?? column;
    const found = await this.#engine.groups(column, by, transform);
    const named = found.filter((g) => g.value !== null);
    const base = { column, dropText: this.#options.dropText, qq: this.#options.qq, transform };
    const requests: QueryRequest[] = named.map((g) => ({
      ...base,
      label: `${label} — ${by} = ${g.value}`,
      group: { by, value: g.value! },
    }));
    const screened = await this.#engine.screen(requests);
    // Residuals from each group's mean: the screening's (from compensated sums), or for a
    // group too small to screen the engine's own; groups of one value have none.
    const means = named.flatMap((g, i): [string, number][] => {
      const s = screened[i];
      if (!(s instanceof Error)) return [[g.value!, s.analysis.moments.mean]];
      return g.n >= 2 && Number.isFinite(g.mean) ? [[g.value!, g.mean]] : [];
    });
    // A group with censored cells is refused, and its measured values alone would bias the
    // pooled residuals (its smallest values left out): none are pooled then.
    const censored = screened.find((s) => s instanceof PlumbError && s.code === "censored");
    const [res] = censored !== undefined
      ? [censored as PlumbError]
      : means.length
      ? await this.#engine.screen([{
        ...base,
        label: `${label} residuals within ${by}`,
        residuals: { by, means },
      }])
      : [new PlumbError("too-few", "no group has two values")];
    const rows: GroupRow[] = named.map((g, i) => {
      const s = screened[i];
      const counts = {
        missingDropped: g.missing,
        textDropped: this.#options.dropText ? g.text : 0,
      };
      return s instanceof Error
        ? { group: g.value!, n: g.n, ...counts, skipped: _why(s, g.n) }
        : { group: g.value!, n: g.n, ...counts, analysis: s.analysis };
    });
    const total = (k: "missing" | "text") => found.reduce((t, g) => t + g[k], 0);
    return new PlumbGroups(groupResult({
      label,
      groupBy: by,
      adjust: checkAdjustment(this.#groupOptions.adjust),
      groups: rows,
      noGroup: found.find((g) => g.value === null)?.n ?? 0,
      missingDropped: total("missing"),
      textDropped: this.#options.dropText ? total("text") : 0,
      residuals: res instanceof Error ? undefined : res.analysis,
      mergedLabels: [],
    }));
  }

  /** The screening of every group, as plain data. */
  async result(): Promise<GroupResult> {
    return (await this.groups()).result();
  }

  /** CSV with unrounded numbers. */
  async toCSV(): Promise<string> {
    return (await this.groups()).toCSV();
  }

  /** Markdown table. */
  async toMarkdown(): Promise<string> {
    return (await this.groups()).toMarkdown();
  }

  /** Table of groups, then the pooled residuals' card. */
  async [DISPLAY](): Promise<MimeBundle> {
    return await (await this.groups())[DISPLAY]();
  }
}

/**
 * Why the engine did not screen a column or group, in the words the
 * in-memory screening uses.
 *
 * @param e the engine's refusal
 * @param n values in the group (0 when not known)
 */
export function _why(e: Error, n: number): string {
  if (e instanceof PlumbError && e.code === "constant") return "every value is the same";
  if (e instanceof PlumbError && e.code === "too-few") {
    return `only ${n} value${n === 1 ? "" : "s"}; at least 4 are needed`;
  }
  if (e instanceof PlumbError && e.code === "censored") {
    const d = e.detail as { below: number; above: number };
    const sides = [
      ...(d.below > 0 ? [`${d.below} below a limit`] : []),
      ...(d.above > 0 ? [`${d.above} above one`] : []),
    ].join(", ");
    return `${d.below + d.above} censored cells (${sides}): the screening through SQL cannot ` +
      `take them yet, and leaving them out would bias it; load the column into memory, where ` +
      `plumb(table, column) runs the censored analysis`;
  }
  return e.message;
}
