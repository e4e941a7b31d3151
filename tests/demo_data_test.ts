import { equal } from "node:assert/strict";
import { demoCsv } from "../tools/make_demo_data.ts";

// The committed demo file is exactly what the seeded generator writes (the data are invented).
Deno.test("demo/bottling_lab.csv is the seeded generator's output, byte for byte", async () => {
  const committed = await Deno.readTextFile(new URL("../demo/bottling_lab.csv", import.meta.url));
  equal(committed, demoCsv());
});
