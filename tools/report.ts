/**
 * `deno task report <csv> [--column NAME …] [--by NAME] [--out FILE]`:
 * screen a CSV file and write a self-contained HTML report.
 *
 * @module
 */
import { loadTable } from "../lib/data/load_table.ts";
import { PlumbError } from "../lib/errors.ts";
import { writeReport } from "../lib/plumb/report.ts";

/** The usage text. */
export const USAGE = `Usage: deno task report <file.csv> [options]

Screen every numeric column of a CSV file for normality and write a
self-contained HTML report (static charts, no scripts, no network).

Options:
  --column NAME   report on this column (repeat for several; default: all numeric)
  --by NAME       also split each column by this text column
  --out FILE      where to write the report (default: <file>.report.html)
  --title TEXT    the report's title
  --help          show this text
`;

/** Parsed command line. */
export interface ReportArgs {
  readonly file?: string;
  readonly columns: string[];
  readonly by?: string;
  readonly out?: string;
  readonly title?: string;
  readonly help: boolean;
}

/** Parse the command line; unknown flags are errors. */
export function parseArgs(args: readonly string[]): ReportArgs {
  const columns: string[] = [];
  let file: string | undefined,
    by: string | undefined,
    out: string | undefined,
    title: string | undefined;
  let help = false;
  for (let i = 0; i < args.length; i++) {
    const a = args[i];
    const value = () => {
      const v = args[++i];
      if (v === undefined) {
        throw new PlumbError("bad-option", `Option ${a} needs a value: see --help`);
      }
      return v;
    };
    if (a === "--help" || a === "-h") help = true;
    else if (a === "--column") columns.push(value());
    else if (a === "--by") by = value();
    else if (a === "--out") out = value();
    else if (a === "--title") title = value();
    else if (a.startsWith("-")) {
      throw new PlumbError("bad-option", `Unknown option ${a}: see --help`);
    } else if (file === undefined) file = a;
    else throw new PlumbError("bad-option", `Only one input file is read, got a second one: ${a}`);
  }
  return { file, columns, by, out, title, help };
}

if (import.meta.main) {
  try {
    const args = parseArgs(Deno.args);
    if (args.help || !args.file) {
      console.log(USAGE);
      Deno.exit(args.help ? 0 : 2);
    }
    const t0 = performance.now();
    console.error(`reading ${args.file} …`);
    const table = await loadTable(args.file);
    console.error(
      `read ${table.rowCount} rows, ${table.columns.length} columns in ${
        Math.round(performance.now() - t0)
      } ms`,
    );
    const report = await writeReport(table, {
      columns: args.columns.length ? args.columns : undefined,
      by: args.by,
      title: args.title,
      progress: (m) => console.error(`… ${m}`),
    });
    const out = args.out ?? args.file.replace(/\.csv$/i, "") + ".report.html";
    await Deno.writeTextFile(out, report.html);
    for (const s of report.sentences) console.log(`• ${s.split(". ").slice(0, 3).join(". ")}.`);
    console.log(`\nReport written to ${out}`);
  } catch (e) {
    if (e instanceof PlumbError) {
      console.error(`error: ${e.message}`);
      Deno.exit(1);
    }
    throw e;
  }
}
