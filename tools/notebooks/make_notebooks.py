#!/usr/bin/python3
"""Write the demo notebooks' cells (without outputs) from the texts below.

The outputs are then filled by the runner:
  /usr/bin/python3 tools/notebooks/make_notebooks.py
  npx -y deno@2.9.6 fmt notebooks/
  /usr/bin/python3 tools/notebooks/run_notebooks.py --write notebooks/
Cell ids are derived from the notebook name and position, so the files are stable.
"""
import hashlib
from pathlib import Path

import nbformat

ROOT = Path(__file__).resolve().parents[2]
INVENTED = (
    "*The data are invented*: a seeded simulation of a fictional bottling plant's quality lab "
    "(`demo/bottling_lab.csv`, written by `tools/make_demo_data.ts`). No real measurement is shown."
)

NOTEBOOKS = {
    "01_first_look.ipynb": [
        ("md", "# A first look: can these measurements be treated as normal?\n\n" + INVENTED + "\n\n"
         "Four filler lines, two shifts, and four measured quantities per bottle. Before we compute "
         "t-based intervals or control limits for any of them, we check each one's shape."),
        ("code", 'import { loadTable, plumb, survey } from "../mod.ts";'),
        ("md", "## Load the table\n\nLoading never coerces silently: every column reports how many cells "
         "were numbers, missing, or text, and the first text cells with their rows. Look for "
         "mistyped entries before anything else."),
        ("code", 'const table = await loadTable("../demo/bottling_lab.csv");\ntable;'),
        ("md", "## Screen every numeric column\n\nOne row per column, sorted so the clearest departures come "
         "first. `dropText: true` leaves the few mistyped cells out, and the counts say how many. "
         "The p-values are adjusted (Holm) because four columns are tested at once. Read the effect "
         "sizes (G1 for skew, G2 for tails) beside W and p."),
        ("code", "survey(table, { dropText: true });"),
        ("md", "## Inspect one column\n\nCap torque looked skewed in the survey. The card shows the reading "
         "in words, the QQ plot with its envelope beside the histogram, and every test."),
        ("code", 'const torque = plumb(table, "cap_torque_nm", { dropText: true });\ntorque;'),
        ("md", "## Reading the QQ plot\n\nEach point is one ordered value (y, in N·m) against the normal "
         "score it would have in a perfectly normal sample (x). The line's intercept is the mean and its "
         "slope the standard deviation, so a normal sample hugs the line. The shaded band is where 95% of "
         "points would fall, point by point, if the data were normal. Points curving up at the right end "
         "mean a long right tail: the skew the reading reports."),
        ("code", "torque.qq();"),
        ("md", "The detrended view subtracts the line, so small, systematic bends in the tails are easier "
         "to see."),
        ("code", "torque.detrended();"),
        ("md", "Net fill volume, by contrast, shows no clear departure. With about 240 values that is "
         "reasonable evidence, but a large p never proves normality."),
        ("code", 'plumb(table, "fill_ml", { dropText: true }).sentence();'),
    ],
    "02_reexpression.ipynb": [
        ("md", "# Re-expression: which transformation makes a skewed column normal?\n\n" + INVENTED),
        ("code", 'import { loadTable, plumb } from "../mod.ts";\n'
                 'const table = await loadTable("../demo/bottling_lab.csv");'),
        ("md", "## A right-skewed column\n\nMinutes between stoppages behave like waiting times: many short "
         "gaps, a few long ones."),
        ("code", 'const gaps = plumb(table, "minutes_between_stops");\ngaps;'),
        ("md", "## The ranked candidates\n\nEach candidate is applied and re-tested with every test. The "
         "ranking prefers the simplest re-expression whose departure (1 − W′) is within chance of the "
         "best one, and says why it chose it. Below the table: the chosen candidate's mean and interval "
         "mapped back to minutes, under the name of what it now estimates."),
        ("code", "gaps.candidates();"),
        ("md", "## The λ explorer\n\nBox–Cox λ sweeps the ladder of powers: λ = 1 leaves the data as they are, "
         "½ is a square root, 0 a log, −1 a reciprocal. The strip shows the profile log-likelihood with "
         "λ̂ and its 95% interval; where Vega runs, the slider redraws the QQ plot and W for each λ "
         "without a round trip to the kernel. The static picture shows λ̂."),
        ("code", "gaps.lambda();"),
        ("md", "## Carry the chosen one forward\n\n`reexpress()` (the same as `reexpress(\"best\")`) returns "
         "a new chain on the transformed values, labelled with the transformation everywhere it appears. "
         "When no candidate beats the data as measured, the chain keeps them as they are and `.choice` "
         "says so."),
        ("code", 'const best = gaps.reexpress();\nbest;'),
        ("code", "best.sentence();"),
        ("md", "## When no re-expression can help\n\nDissolved oxygen has readings at 0: values below the "
         "detection limit. A log needs a shift (chosen by a stated rule and reported), and the pile-up at "
         "the floor stays a pile-up whatever the power. The reading says so."),
        ("code", 'plumb(table, "oxygen_ppb", { dropText: true }).reexpress("log");'),
    ],
    "03_groups_and_writeup.ipynb": [
        ("md", "# Groups and the write-up\n\n" + INVENTED),
        ("code", 'import { loadTable, plumb, survey } from "../mod.ts";\n'
                 'const table = await loadTable("../demo/bottling_lab.csv");'),
        ("md", "## Per-line checks\n\nThe four filler lines have slightly different mean fill volumes, so the "
         "pooled column mixes four normals. For an ANOVA or a t-test the assumption concerns the "
         "residuals (each value minus its line's mean): they are pooled below the per-line rows, with "
         "their own QQ plot and tests. p-values across lines are Holm-adjusted."),
        ("code", 'const fill = plumb(table, "fill_ml", { dropText: true }).by("line");\nfill;'),
        ("md", "## Sentences to paste\n\nEach sentence carries the variable, n, W and p, and the cautions "
         "that apply."),
        ("code", "fill.sentences();"),
        ("md", "A re-expressed column's sentence says which scale its statements apply to."),
        ("code", 'plumb(table, "cap_torque_nm", { dropText: true }).reexpress("best").sentence();'),
        ("md", "## Export the tables\n\nEvery table exports as CSV (numbers unrounded) and Markdown."),
        ("code", 'console.log(fill.toCSV());'),
        ("code", 'console.log(survey(table, { dropText: true }).toMarkdown());'),
        ("md", "## Save for a report or a slide\n\nEvery display saves itself with `.save(path)`; the file "
         "type follows the extension (`.svg`, `.png`, `.html`, `.md`, `.csv`, `.json`). `report(...)` "
         "writes the same self-contained HTML report as `deno task report`, for the table or for any "
         "set of chains. Here the files go to a temporary folder."),
        ("code", 'import { report } from "../mod.ts";\n'
                 'const dir = await Deno.makeTempDir();\n'
                 'const saved = [\n'
                 '  await plumb(table, "minutes_between_stops").qq().save(`${dir}/gaps_qq.png`),\n'
                 '  await fill.save(`${dir}/fill_by_line.csv`),\n'
                 '  await fill.sentences().save(`${dir}/fill_by_line.md`),\n'
                 '  await report(table, { by: "line", note: "Invented data." }).save(`${dir}/lab_report.html`),\n'
                 '];\n'
                 'for (const s of saved) console.log(`${s.path.slice(dir.length + 1)}: ${s.format}`);'),
    ],
    "04_data_in.ipynb": [
        ("md", "# Data in: workbooks, Parquet, data frames and awkward CSV\n\n" + INVENTED + " The lab's "
         "exports below (`demo/lab_export.xlsx`, `demo/fills.parquet`) hold the same invented rows and "
         "are written by `tools/make_demo_exports.ts`.\n\nWhatever the source, every cell ends up a "
         "number, a censored value (below or above a limit), missing, or text, and the table says how "
         "many of each."),
        ("code", 'import { loadTable, plumb } from "../mod.ts";\n'
                 'const qc = await loadTable("../demo/lab_export.xlsx");\nqc;'),
        ("md", "## The workbook\n\nThe first visible sheet is read; its title row and the blank row under it "
         "are skipped, the sampling day reads as text, and oxygen readings written `<4` (below the 4 ppb "
         "detection limit) are kept as censored values with their limit, counted apart from numbers. "
         "Row numbers in messages are the sheet's own. Pick another sheet with `{ sheet: \"Notes\" }`."),
        ("code", 'const fills = await loadTable("../demo/fills.parquet");\nfills;'),
        ("md", "## Parquet, Arrow and data frames\n\nNulls are missing cells in every columnar source; an "
         "Arrow column's null slots are never read as 0."),
        ("code", 'import * as arrow from "npm:apache-arrow@21.2.0";\n'
                 'const torque = arrow.vectorFromArray([1.92, null, 2.05, 1.77, null, 1.88], new arrow.Float64());\n'
                 'await loadTable(new arrow.Table({ torque }));'),
        ("code", 'import pl from "npm:nodejs-polars@0.25.2";\n'
                 'const frame = pl.DataFrame({ line: ["A", "B", "A", null], fill_ml: [500.2, 499.6, null, 500.9] });\n'
                 'await loadTable(frame);'),
        ("md", "A polars Series is one column, named by the series."),
        ("code", 'plumb(pl.Series("fill_ml", [500.2, 499.6, 500.9, 500.1, null, 499.8, 500.4, 500.0])).sentence();'),
        ("md", "## Awkward CSV\n\nA German export: `;` between fields, decimal commas, a comma inside a "
         "header name, and the spreadsheet program's `sep=;` line. Cells such as `<0,5` are censored; "
         "a word such as `n.n.` (not detected) needs the column's limit."),
        ("code", 'const export_de = "sep=;\\nProbe;Konzentration, mg/L\\nP1;1,25\\nP2;<0,5\\nP3;n.n.\\nP4;2,10\\n";\n'
                 'await loadTable(export_de, { detectionLimits: { "Konzentration, mg/L": 0.5 }, missing: ["NA"] });'),
        ("md", "Bytes that are not UTF-8 are an error that names the line and the likely encoding; the "
         "`encoding` option reads them."),
        ("code", '// "p,O2 µg" and "A,12" as a Windows program writes them: µ is the byte 0xB5.\n'
                 'const w1252 = new Uint8Array([0x70, 0x2c, 0x4f, 0x32, 0x20, 0xb5, 0x67, 0x0a, 0x41, 0x2c, 0x31, 0x32, 0x0a]);\n'
                 'try {\n  await loadTable(w1252, { from: "text" });\n} catch (e) {\n  console.log((e as Error).message);\n}\n'
                 'await loadTable(w1252, { from: "text", encoding: "windows-1252" });'),
        ("md", "## Group labels that differ only in spaces\n\n`\" A\"`, `\"A \"` and `\"A\\u00a0\"` (a no-break space) look "
         "alike on screen; they are one group, and the table says which spellings were merged."),
        ("code", 'plumb({\n  line: ["A", " A", "A\\u00a0", "A ", "A", "B", "B", "B", "B", "B"],\n'
                 '  fill_ml: [500.1, 499.8, 500.4, 500.0, 499.7, 500.2, 500.3, 499.9, 500.6, 499.5],\n'
                 '}, "fill_ml").by("line").table().notes;'),
        ("md", "## Not a table\n\nA Set, a generator, raw bytes or a promise is refused with what to give "
         "instead, never loaded as an empty table."),
        ("code", 'try {\n  await loadTable(new Set([500.1, 499.8]));\n} catch (e) {\n  console.log((e as Error).message);\n}'),
        ("md", "## Misspelt options and repeated columns\n\nAn option the call does not know is refused with "
         "the nearest one it does know, never silently ignored; a column named twice in `survey` is "
         "screened once, so the adjustment's family is not inflated."),
        ("code", 'import { survey } from "../mod.ts";\n'
                 'try {\n  plumb(fills, "fill_ml", { dropTxt: true });\n} catch (e) {\n  console.log((e as Error).message);\n}\n'
                 'survey(fills, { columns: ["fill_ml", "fill_ml"] }).table().notes;'),
        ("md", "## Wrapped headers, extreme magnitudes, and where a re-expression fails\n\nA spreadsheet header "
         "wrapped onto two lines keeps its line break in the name, and every chart still draws. Values of "
         "extreme size (here an export that wrote litres as 1e−309-scale numbers) are plotted in units of a "
         "power of ten named on the axis; the numbers in the text keep their own units."),
        ("code", 'const wrapped = "Fill volume\\n(mL)";\n'
                 'plumb({ [wrapped]: [500.1, 499.8, 500.4, 500.0, 499.7, 500.2, 500.3, 499.9, 500.6, 499.5] }, wrapped).qq();'),
        ("code", 'plumb([1.1, 0.9, 1.4, 1.0, 0.7, 1.2, 1.3, 0.95, 1.6, 0.5].map((v) => v * 1e-309), "fill_scaled").histogram();'),
        ("md", "A re-expression that cannot apply names the data rows and the file's lines where it fails."),
        ("code", 'const withZero = await loadTable("sample,stops_min\\nS1,18.4\\nS2,32.1\\nS3,0\\nS4,7.5\\nS5,12.0\\n");\n'
                 'try {\n  plumb(withZero, "stops_min").reexpress("reciprocal").analysis();\n} catch (e) {\n  console.log((e as Error).message);\n}'),
    ],
    "05_what_it_changes.ipynb": [
        ("md", "# What the departure changes for the next number\n\n" + INVENTED + "\n\n"
         "A p-value says whether a departure from normality can be seen, not whether it matters. "
         "`.stakes()` computes the figures the lab reports next — a central range, the share outside "
         "specification limits, Cpk, the mean's interval — the normal-theory way, on a re-expression "
         "mapped back to the original units, and without a model, on one axis per figure, and says in "
         "words whether the difference matters.\n\n"
         "Reference ranges and release decisions follow your organisation's procedures and the "
         "applicable standards; these figures inform such a decision, they do not make it."),
        ("code", 'import { loadTable, plumb } from "../mod.ts";\n'
                 'const table = await loadTable("../demo/bottling_lab.csv");'),
        ("md", "## Fill volume against its specification limits\n\nThe invented label claim needs every "
         "bottle between 497 and 503 mL. Fill volume is close to normal, so the normal fit's share "
         "outside should agree with the share observed (with its exact Clopper–Pearson interval). "
         "The percentile-based index needs about 740 values for its 0.135% points, and says so."),
        ("code", 'const fill = plumb(table, "fill_ml", { dropText: true }).stakes({ lower: 497, upper: 503 });\nfill;'),
        ("md", "## Cap torque: capability on a skewed quantity\n\nCap torque is right-skewed. Cpk rests "
         "on the tails, so it is computed on the data as measured (with Bissell's interval), on the "
         "chain's re-expression with the limits mapped there, and from percentiles."),
        ("code", 'plumb(table, "cap_torque_nm", { dropText: true }).reexpress("log").stakes({ lower: 1.2, upper: 2.8 });'),
        ("md", "Per filler line, every group on one axis so their ranges compare by eye. The table keeps "
         "every figure; each paragraph is written for its line."),
        ("code", 'plumb(table, "cap_torque_nm", { dropText: true }).by("line").stakes({ lower: 1.2, upper: 2.8 });'),
        ("md", "## A central range for dissolved oxygen\n\nOxygen cannot be negative, yet mean ± 1.96·sd "
         "puts its lower limit below zero: the chart marks that end. The rank-based limits carry their "
         "90% confidence intervals from order statistics, as laboratory reference-interval practice "
         "computes them; the notes say how many values that practice asks for."),
        ("code", 'const oxygen = plumb(table, "oxygen_ppb", { dropText: true }).stakes();\noxygen;'),
        ("md", "## For the write-up and the files\n\nThe paragraph, the figures as CSV (numbers "
         "unrounded), and `save(path)` for `.html`, `.md`, `.svg`, `.png`, `.csv` or `.json`."),
        ("code", "oxygen.sentence();"),
        ("code", "console.log(fill.toCSV());"),
    ],
    "06_below_detection.ipynb": [
        ("md", "# Values below the detection limit\n\n" + INVENTED + " The workbook "
         "`demo/lab_export.xlsx` holds the same invented rows, written by `tools/make_demo_exports.ts`.\n\n"
         "The lab reports dissolved oxygen below its 4 ppb detection limit as `<4`. Such a value is "
         "not 4 and not missing: it is known only to lie below 4. Dropping these values, or analysing "
         "them as 4, biases the mean, the sd and the shape. plumbline keeps them as censored values and "
         "screens the column with methods made for them."),
        ("code", 'import { loadTable, plumb } from "../mod.ts";\n'
                 'const qc = await loadTable("../demo/lab_export.xlsx");\n'
                 'const oxygen = plumb(qc, "Oxygen (ppb)", { dropText: true });\noxygen;'),
        ("md", "The card counts the censored values with the measured ones (`n`), gives the mean and sd by "
         "maximum likelihood under censoring, and tests normality with the Shapiro–Francia test for "
         "censored samples; the tests for complete samples are listed as not run. On the QQ plot the "
         "censored values are the grey squares at the limit, spread over the share of the probability "
         "scale that the Hirsch–Stedinger positions give them; the line is the censored fit."),
        ("code", "oxygen.analysis().censoring;"),
        ("md", "## On the log scale\n\nThe limit is re-expressed with the values: `<4` becomes "
         "`<ln 4`, and every censored value stays censored."),
        ("code", 'const logged = oxygen.reexpress("log");\nlogged.qq();'),
        ("code", "logged.sentence();"),
        ("md", "## By filler line\n\nEach line is screened with its own censored values."),
        ("code", 'logged.by("line");'),
        ("md", "## What needs measured values\n\nRanking re-expressions, the λ explorer and the stakes "
         "view use methods for measured values; on a censored column they stop and say what to do "
         "instead rather than treat the limits as measurements."),
        ("code", 'try {\n  oxygen.candidates().toJSON();\n} catch (e) {\n  console.log((e as Error).message);\n}'),
    ],
    "07_larger_than_memory.ipynb": [
        ("md", "# Larger than memory: screening a historian export through SQL\n\n*The data are invented*: "
         "the filler lines' inline fill-volume sensor of a fictional bottling plant, one reading per bottle, "
         "generated below from deterministic formulas by DuckDB into a Parquet file in a temporary folder. "
         "A real historian export runs to hundreds of millions of rows; this one has one million, so "
         "that the notebook runs in a few seconds.\n\n`scan(pathOrSql)` keeps the values inside an "
         "embedded DuckDB database: `plumb`, `survey` and `.by()` accept it and give the same analysis, "
         "card and tables as in memory, computed from aggregates, exact order statistics and a seeded "
         "sample. Reads return promises (`await`); shown in a notebook, nothing needs awaiting."),
        ("code", 'import { DuckDBInstance } from "npm:@duckdb/node-api@1.5.6-r.1";\n'
                 'import { plumb, scan, survey } from "../mod.ts";\n\n'
                 '// Pseudo-random normal scores from a hash of the row number (Box–Muller), so every run writes the same file.\n'
                 'const u = (k: number) => `((hash(i + ${k}) % 2147483629) + 0.5) / 2147483629.0`;\n'
                 'const z = (a: number, b: number) => `sqrt(-2 * ln(${u(a)})) * cos(2 * pi() * ${u(b)})`;\n'
                 'const dir = await Deno.makeTempDir();\n'
                 'const path = `${dir}/filler_historian.parquet`;\n'
                 'const db = await DuckDBInstance.create(":memory:");\n'
                 'const con = await db.connect();\n'
                 'await con.run(`COPY (\n'
                 '  SELECT \'L\' || (i % 4 + 1) AS line,\n'
                 '         CASE WHEN i % 4 = 2 THEN 499.2 + exp(0.5 + 0.6 * ${z(0, 1)}) ELSE 500 + 0.9 * ${z(0, 1)} END AS fill_ml,\n'
                 '         1.9 * exp(0.12 * ${z(2, 3)}) AS cap_torque_nm\n'
                 '  FROM range(1000000) t(i)) TO \'${path}\' (FORMAT parquet)`);\n'
                 'con.closeSync();\n'
                 'db.closeSync();\n\n'
                 '// progress: false keeps the saved outputs identical between runs; by default a scan longer\n'
                 '// than about two seconds shows a progress line here.\n'
                 'const historian = scan(path, { progress: false });\n'
                 'await historian.columns();'),
        ("md", "## Survey every numeric column\n\nThe same table as for a loaded file. Shapiro–Wilk (and the other "
         "order-statistic tests) ran on a seeded random sample of 5,000 of the million values, and the notes "
         "say so; the moments, D'Agostino–Pearson, Jarque–Bera, the QQ points and the histogram use every value."),
        ("code", "survey(historian);"),
        ("md", "## One column's card\n\nThe QQ points are exact order statistics at the plotted ranks, read by "
         "the engine; the histogram counts every value. With a million values every test rejects even a "
         "harmless departure, so the verdict rests on the effect sizes (G1, G2)."),
        ("code", 'plumb(historian, "fill_ml");'),
        ("md", "## Which values the tests used\n\n`subsample` states the seeded sample behind the "
         "order-statistic tests; the same seed draws the same sample."),
        ("code", 'const a = await plumb(historian, "fill_ml").analysis();\n'
                 '({ n: a.n, subsample: a.subsample, shapiroWilk: a.primary.method });'),
        ("md", "## Per filler line\n\nOne screening per line (a filter on `line`), p-values adjusted across the "
         "lines, and the residuals from each line's mean pooled: the view that matters before an ANOVA. "
         "Line L3's skew is what makes the pooled residuals depart."),
        ("code", 'plumb(historian, "fill_ml").by("line");'),
        ("md", "## Re-expressed by the engine\n\n`.reexpress()` ranks the candidates on the seeded sample, "
         "then has the engine re-express every value in SQL and screens the result (a Box–Cox λ would be "
         "fitted over every value). Here it declines, and says why."),
        ("code", 'const best = plumb(historian, "fill_ml").reexpress();\n'
                 '(await best.choice()).reason;'),
        ("md", "Asked for by name, the log of every value is computed by the engine:"),
        ("code", 'const logged = await plumb(historian, "fill_ml").reexpress("log").analysis();\n'
                 '({ label: logged.origin.label, verdict: logged.reading.verdict, g1: logged.moments.g1 });'),
        ("md", "## Any SQL query\n\nA query over the files is a source too: here the lines without the skewed one."),
        ("code", 'const steady = scan(\n'
                 '  `SELECT fill_ml FROM read_parquet(\'${path}\') WHERE line <> \'L3\'`,\n'
                 '  { progress: false },\n'
                 ');\n'
                 '(await plumb(steady, "fill_ml").sentence()).text;'),
        ("md", "## A file with a row number and a text column\n\nExports often carry a row number, and "
         "a sensor that now and then logged a word instead of a reading makes DuckDB read its column as "
         "text. The survey decides as it would in memory: the row number is left out, with the reason in "
         "the notes, and the torque column, which reads mostly as numbers, is screened once its text "
         "cells are left out on request (`dropText`), their count shown beside the missing cells."),
        ("code", 'const checks = `${dir}/capper_checks.csv`;\n'
                 'const db2 = await DuckDBInstance.create(":memory:");\n'
                 'const con2 = await db2.connect();\n'
                 'await con2.run(`COPY (\n'
                 '  SELECT i + 1 AS check_no,\n'
                 '         CASE WHEN i % 50 = 7 THEN \'jammed\' ELSE CAST(round(1.9 * exp(0.12 * ${z(4, 5)}), 3) AS VARCHAR) END AS cap_torque_nm,\n'
                 '         round(500 + 0.9 * ${z(6, 7)}, 2) AS fill_ml\n'
                 '  FROM range(20000) t(i)) TO \'${checks}\' (FORMAT csv, HEADER)`);\n'
                 'con2.closeSync();\n'
                 'db2.closeSync();\n'
                 'survey(scan(checks, { progress: false }), { dropText: true });'),
        ("md", "## The lighter screening, for hundreds of millions of rows\n\nAbove 10 million values a scan "
         "reads the QQ values, the histogram counts, the skewness and the kurtosis from its one pass over "
         "the cells, instead of a second pass and two more sums per cell: about half the work. Each is then "
         "within a bound the scan computes and states, in `precision` and as the reading's last point; "
         "the sampled tests are the same. `exact: false` asks for it here, on the million values, to show "
         "what it says (`exact: true` asks for the exact screening at any size)."),
        ("code", 'const light = await scan(path, { progress: false, exact: false }).analyse("fill_ml");\n'
                 'const p = light.precision;\n'
                 '({\n'
                 '  exact: p.exact,\n'
                 '  cells: p.cells,\n'
                 '  qqValueWithin: +p.maxValueError.toPrecision(2),\n'
                 '  binCountWithin: p.maxCountError,\n'
                 '  skewnessWithin: +p.maxSkewnessError.toPrecision(1),\n'
                 '  kurtosisWithin: +p.maxKurtosisError.toPrecision(1),\n'
                 '  readingSays: light.reading.points.at(-1),\n'
                 '});'),
        ("md", "## Values below a detection limit\n\nA laboratory reports a result under its detection "
         "limit as the limit with a sign (`<0.02`). Such a cell is a censored value, not text: leaving it "
         "out would remove the smallest values and bias every result. The scan counts these cells apart "
         "from text and refuses the column, even with `dropText`, naming the limits and what to do; in "
         "memory, the chain runs the analysis for censored data. (Invented rinse-water checks: residual "
         "chlorine in mg/L, about a quarter below the limit.)"),
        ("code", 'import { loadTable } from "../mod.ts";\n\n'
                 'const rinse = `${dir}/rinse_checks.csv`;\n'
                 'const db3 = await DuckDBInstance.create(":memory:");\n'
                 'const con3 = await db3.connect();\n'
                 'await con3.run(`COPY (\n'
                 '  SELECT i + 1 AS check_no,\n'
                 '         CASE WHEN c < 0.02 THEN \'<0.02\' ELSE CAST(c AS VARCHAR) END AS chlorine_mg_l\n'
                 '  FROM (SELECT i, round(exp(-3.5 + 0.6 * ${z(8, 9)}), 3) AS c FROM range(400) t(i)))\n'
                 '  TO \'${rinse}\' (FORMAT csv, HEADER)`);\n'
                 'con3.closeSync();\n'
                 'db3.closeSync();\n'
                 'try {\n'
                 '  await plumb(scan(rinse, { progress: false }), "chlorine_mg_l", { dropText: true }).analysis();\n'
                 '} catch (e) {\n'
                 '  console.log((e as Error).message);\n'
                 '}'),
        ("code", 'plumb(await loadTable(rinse), "chlorine_mg_l");'),
        ("code", "await Deno.remove(dir, { recursive: true });"),
    ],
    "08_models_and_order.ipynb": [
        ("md", "# Residuals of a model, two grouping columns, and the order of the checks\n\n"
         "*The data are invented*: a seeded simulation of a week of in-process fill checks at the "
         "same fictional bottling plant (`demo/filling_log.csv`, written by "
         "`tools/make_filling_log.ts`). Every 30 minutes of each shift one bottle from each of the "
         "four filler lines is weighed, with the product temperature at the filler. No real "
         "measurement is shown."),
        ("code", 'import { loadTable, plumb } from "../mod.ts";\n'
                 'const log = await loadTable("../demo/filling_log.csv");\nlog;'),
        ("md", "## The residuals of a linear model\n\nFill volume depends on the line, the shift and "
         "the product temperature. Before an ANOVA or a regression on these, the normality that "
         "matters is that of the residuals. `.residuals()` fits the model by least squares and "
         "screens its externally studentised residuals; the QQ plot's envelope is simulated on "
         "this very design, and the reading says why the tests are only approximate here."),
        ("code", 'const fill = plumb(log, "fill_ml");\n'
                 'const model = fill.residuals({ factors: ["line", "shift"], covariates: ["filler_temp_c"] });\n'
                 'model;'),
        ("md", "The fit itself is plain data: coefficients with standard errors, rank, residual degrees "
         "of freedom, and any column left out as explained by the others."),
        ("code", 'const fit = model.model();\n'
                 'fit.coefficients.map((c) => `${c.name}: ${c.estimate.toFixed(3)} ± ${c.se.toFixed(3)}`);'),
        ("md", "A temperature written twice (°C and °F) is one column too many: the model names it and "
         "says what to do."),
        ("code", 'const twice = await loadTable({\n'
                 '  fill_ml: [...fill.values()].slice(0, 12),\n'
                 '  temp_c: [18, 19, 20, 21, 18, 19, 20, 22, 19, 18, 21, 20],\n'
                 '  temp_f: [64.4, 66.2, 68, 69.8, 64.4, 66.2, 68, 71.6, 66.2, 64.4, 69.8, 68],\n'
                 '});\n'
                 'try {\n'
                 '  plumb(twice, "fill_ml").residuals({ covariates: ["temp_c", "temp_f"] }).values();\n'
                 '} catch (e) {\n'
                 '  console.log((e as Error).message);\n'
                 '}'),
        ("md", "## Two grouping columns\n\n`.by([\"line\", \"shift\"])` screens each line × shift cell; "
         "the pooled residuals below the table are those of the cell-means model."),
        ("code", 'fill.by(["line", "shift"]);'),
        ("md", "## The order of the checks\n\nEvery normality p-value assumes independent observations. "
         "The file lists the checks line by line, so its row order is not the time order: name the "
         "time column. Each line's residuals, in time order: the drifting line stands out."),
        ("code", 'const timed = plumb(log, "fill_ml", { order: "checked_at" })\n'
                 '  .residuals({ factors: ["line", "shift"], covariates: ["filler_temp_c"] });\n'
                 'timed.by("line");'),
        ("md", "All the residuals in time order: four checks share each time, one per line, so this "
         "order interleaves the lines, and the reading says so. The per-line rows above are the "
         "cleaner view."),
        ("code", "timed.sequence();"),
        ("md", "The write-up carries the model, the residual type and the warning about order."),
        ("code", "timed.sentence();"),
    ],
}


def cell_id(name, k):
    return hashlib.sha256(f"{name}:{k}".encode()).hexdigest()[:8]


def main():
    for name, cells in NOTEBOOKS.items():
        nb = nbformat.v4.new_notebook()
        nb.metadata = {
            "kernelspec": {"display_name": "Deno", "language": "typescript", "name": "deno"},
            "language_info": {"name": "typescript"},
        }
        for k, (kind, text) in enumerate(cells):
            c = nbformat.v4.new_markdown_cell(text) if kind == "md" else nbformat.v4.new_code_cell(text)
            c["id"] = cell_id(name, k)
            nb.cells.append(c)
        nbformat.write(nb, str(ROOT / "notebooks" / name))
        print(f"wrote notebooks/{name} ({len(cells)} cells)")


if __name__ == "__main__":
    main()
