import { equal } from "node:assert/strict";
import { fillingLogCsv } from "../tools/make_filling_log.ts";

// The committed fill log is exactly what the seeded generator writes (the data are invented).
Deno.test("demo/filling_log.csv is the seeded generator's output, byte for byte", async () => {
  const committed = await Deno.readTextFile(new URL("../demo/filling_log.csv", import.meta.url));
  equal(committed, fillingLogCsv());
});
