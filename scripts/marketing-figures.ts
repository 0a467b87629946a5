/**
 * Writes lib/examples/example-figures.json: every number the landing page, the sign-in
 * panel and the sweep figure print about the invented three-spin cluster, computed by
 * the engine (seeded, so the file only changes when the model or the engine does).
 *
 *   node --conditions=react-server --import tsx scripts/marketing-figures.ts
 *
 * tests/unit/examples/example-figures.test.ts fails when the file and the engine disagree.
 */
import { writeFileSync } from "node:fs";
import { fileURLToPath } from "node:url";
import { computeExampleFigures } from "@/lib/examples/example-figures";

const target = fileURLToPath(new URL("../lib/examples/example-figures.json", import.meta.url));
const figures = await computeExampleFigures();
writeFileSync(target, `${JSON.stringify(figures, null, 2)}\n`);
console.log(
  `wrote ${target}: exact ${figures.exact}, sampled ${figures.sampled.mean} ± ${figures.sampled.stdErr}, ` +
    `${figures.curve.length} curve points, ${figures.points.length} sampled points`,
);
