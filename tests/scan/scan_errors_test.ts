/**
 * Scan errors (missing file, text column, failing query, unknown column),
 * cancellation, progress reports and the seeded sample.
 *
 * @module
 */
import assert from "node:assert/strict";
import { PlumbError, scan } from "../../mod.ts";

async function rejects(p: Promise<unknown>, code: string, message: RegExp): Promise<void> {
  await assert.rejects(p, (e: unknown) => {
    assert.ok(e instanceof PlumbError, `expected a PlumbError, got ${e}`);
    assert.equal(e.code, code);
    assert.match(e.message, message);
    return true;
  });
}

Deno.test("scan: a missing file says so, with DuckDB's message and what to do", async () => {
  await rejects(
    scan("no/such/folder/readings.parquet", { progress: false }).analyse("x"),
    "not-found",
    /^Cannot scan ".*readings\.parquet": DuckDB says ".*No files found.*"; check the path/,
  );
});

Deno.test("scan: a failing query gives DuckDB's message", async () => {
  await rejects(
    scan("SELECT x FROM range(10) t(i)", { progress: false }).analyse(),
    "unknown-column",
    /DuckDB says "Binder Error: Referenced column "x" not found/,
  );
  await rejects(
    scan("SELECT 1 / 'a' AS x", { progress: false }).analyse(),
    "query-failed",
    /^Cannot scan .*: DuckDB says ".*"; check the file's format or the SQL text/,
  );
});

Deno.test("scan: a non-numeric column, text cells, unknown columns", async () => {
  // "n/a" is a missing-value token (lib/data/missing.ts): missing, as in memory; "jam" is text.
  const q =
    "SELECT i::DOUBLE AS v, CASE WHEN i % 100 = 0 THEN 'jam' WHEN i % 100 = 50 THEN 'n/a' " +
    "ELSE i::VARCHAR END AS t, 'day ' || i::VARCHAR AS label FROM range(1, 1001) r(i)";
  await rejects(
    scan(q, { progress: false }).analyse("label"),
    "non-numeric",
    /: 1000 of 1000 cells are text, not numbers \("day 1", .*\); clean them, or pass \{ dropText: true \}/,
  );
  await rejects(
    scan(q, { progress: false }).analyse("t"),
    "non-numeric",
    /: 10 of 990 cells are text, not numbers \("jam", "jam", "jam", "jam", "jam", …\)/,
  );
  const kept = await scan(q, { progress: false, dropText: true }).analyse("t");
  assert.equal(kept.n, 980);
  assert.equal(kept.counts.missing, 10);
  assert.equal(kept.counts.text, 10);
  assert.equal(kept.origin.textDropped, 10);
  await rejects(scan(q, { progress: false }).analyse("w"), "unknown-column", /No column named "w"/);
  await rejects(
    scan("SELECT DATE '2024-01-01' + CAST(i AS INTEGER) AS d, i AS k FROM range(9) t(i)", {
      progress: false,
    })
      .analyse("d"),
    "non-numeric",
    /its type is DATE, not a number/,
  );
});

Deno.test("scan: missing and non-finite values are counted, not analysed", async () => {
  const a = await scan(
    "SELECT CASE WHEN i % 50 = 0 THEN NULL WHEN i = 7 THEN 'Infinity'::DOUBLE " +
      "ELSE sin(i) END AS x FROM range(1, 2001) t(i)",
    { progress: false },
  ).analyse();
  assert.equal(a.counts.rows, 2000);
  assert.equal(a.counts.missing, 40);
  assert.equal(a.counts.nonFinite, 1);
  assert.equal(a.n, 1959);
  assert.equal(a.sample.size, 1959);
});

Deno.test("scan: the same seed gives the same sample, another seed another", async () => {
  const q = "SELECT exp(sin(i * 0.37) + cos(i * 1.3)) AS x FROM range(1, 50001) t(i)";
  const one = await scan(q, { progress: false, seed: 11 }).analyse();
  const two = await scan(q, { progress: false, seed: 11 }).analyse();
  const other = await scan(q, { progress: false, seed: 12 }).analyse();
  assert.equal(one.primary.statistic, two.primary.statistic);
  assert.notEqual(one.primary.statistic, other.primary.statistic);
  assert.equal(one.sample.seed, 11);
  assert.match(one.sample.method, /seeded reservoir sample of 5000 of 50000 values \(DuckDB\)/);
});

Deno.test("scan: cancelling stops the scan and keeps nothing", async () => {
  const controller = new AbortController();
  const src = scan("SELECT sin(i) * cos(i / 7) AS x FROM range(30000000) t(i)", {
    progress: false,
    signal: controller.signal,
  });
  const running = src.analyse();
  setTimeout(() => controller.abort(), 200);
  await rejects(running, "cancelled", /^The scan of .* was cancelled: nothing was kept/);
  const early = new AbortController();
  early.abort();
  await rejects(
    scan("SELECT i AS x FROM range(10) t(i)", { progress: false, signal: early.signal }).analyse(),
    "cancelled",
    /was cancelled/,
  );
});

Deno.test("scan: progress is reported after the delay, ending with a done report", async () => {
  const seen: { step: string; done: boolean; fraction: number }[] = [];
  await scan("SELECT sin(i) AS x FROM range(200000) t(i)", {
    progress: (p) => seen.push(p),
    progressAfter: 0,
  }).analyse();
  assert.ok(seen.length >= 1);
  assert.equal(seen[seen.length - 1].done, true);
  assert.ok(seen.every((p) => Number.isNaN(p.fraction) || (p.fraction >= 0 && p.fraction <= 1)));
});

Deno.test("scan: without --allow-ffi, importing works and a scan says what to grant", async () => {
  const code = `import { scan, shapiroWilk } from ${
    JSON.stringify(new URL("../../mod.ts", import.meta.url).href)
  };
console.log(shapiroWilk([1, 2, 3, 4.5, 7]).n);
try { await scan("SELECT 1.0 * i AS x FROM range(10) t(i)", { progress: false }).analyse(); }
catch (e) { console.log(e.code, e.message); }`;
  const dir = await Deno.makeTempDir();
  const file = `${dir}/screen.ts`;
  await Deno.writeTextFile(file, code);
  const out = await new Deno.Command(Deno.execPath(), {
    args: ["run", "--allow-read", "--allow-env", file],
    stdout: "piped",
    stderr: "piped",
  }).output();
  await Deno.remove(dir, { recursive: true });
  const text = new TextDecoder().decode(out.stdout);
  assert.match(text, /^5\n/);
  assert.match(
    text,
    /unavailable Cannot start DuckDB for a scan: .*; run with --allow-ffi \(or -A\)/,
  );
});

Deno.test("scan: a sample size or seed the sampled tests cannot use is refused up front", () => {
  const sql = "SELECT i AS x FROM range(100000) t(i)";
  for (const sampleSize of [6000, 2, 2.5, Number.NaN]) {
    assert.throws(
      () => scan(sql, { sampleSize }),
      (e: PlumbError) =>
        e.code === "bad-option" &&
        e.message.includes(`sample of ${sampleSize}`) && e.message.includes("from 3 to 5000"),
    );
  }
  for (const seed of [-1, 0.5]) {
    assert.throws(
      () => scan(sql, { seed }),
      (e: PlumbError) =>
        e.code === "bad-option" && e.message.includes(`seed the sample with ${seed}`),
    );
  }
  // The limits themselves are accepted.
  scan(sql, { sampleSize: 5000, seed: 0 });
  scan(sql, { sampleSize: 3 });
});
