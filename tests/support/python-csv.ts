/** Reads CSV text with Python's csv module (an outside RFC 4180 reader; Debian's python3). */
import { execFileSync } from "node:child_process";
import { mkdtempSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";

export function pythonReadCsv(text: string): string[][] {
  const dir = mkdtempSync(join(tmpdir(), "kw-csv-"));
  const file = join(dir, "t.csv");
  writeFileSync(file, text, "utf8");
  const out = execFileSync(
    "python3",
    [
      "-c",
      "import csv,json,sys; print(json.dumps(list(csv.reader(open(sys.argv[1], newline='', encoding='utf-8')))))",
      file,
    ],
    { encoding: "utf8" },
  );
  return JSON.parse(out) as string[][];
}
