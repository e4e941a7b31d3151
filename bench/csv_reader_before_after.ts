/**
 * The quick CSV reader of this tree against the one of another tree (an
 * earlier commit's `lib/`, exported to a folder), on the same seeded texts
 * in the same run, alternating, so that machine load affects both alike.
 *
 * Run: `mkdir -p out/before && git archive <commit> lib | tar -x -C out/before` then
 * `deno run -A bench/csv_reader_before_after.ts out/before [rows] [repeats]`.
 * Prints the median time of each and their ratio for four-decimal and
 * full-precision numbers, and checks both give the same numbers.
 *
 * @module
 */
import { tableFromCsv } from "../lib/data/csv_text.ts";
import { numericCsv } from "./_numeric_csv.ts";

const before = Deno.args[0];
if (before === undefined) throw new Error("give the folder holding the earlier lib/");
const rows = Number(Deno.args[1] ?? 200_000);
const repeats = Number(Deno.args[2] ?? 9);
const old = await import(new URL(`${before}/lib/data/csv_text.ts`, `file://${Deno.cwd()}/`).href);
const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)];
for (const full of [false, true]) {
  const bytes = new TextEncoder().encode(numericCsv(rows, 10, 20260101, full));
  const now: number[] = [];
  const then: number[] = [];
  for (let r = 0; r < repeats; r++) {
    let t0 = performance.now();
    const a = tableFromCsv(bytes);
    now.push(performance.now() - t0);
    t0 = performance.now();
    const b = old.tableFromCsv(bytes);
    then.push(performance.now() - t0);
    if (r === 0) {
      for (const name of a.numericNames()) {
        const x = a.numeric(name).values;
        const y = b.numeric(name).values;
        if (!x.every((v: number, i: number) => Object.is(v, y[i]))) {
          throw new Error(`${name} differs`);
        }
      }
    }
  }
  console.log(
    `${rows} × 10, ${full ? "full precision" : "4 decimals"}: this tree ${
      median(now).toFixed(1)
    } ms, before ${median(then).toFixed(1)} ms, ratio ${(median(now) / median(then)).toFixed(3)}`,
  );
}
