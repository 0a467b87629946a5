import { execFileSync } from "node:child_process";
import { mkdtempSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { describe, expect, it } from "vitest";
import { ZipInputError, zipTextFiles } from "@/lib/export/zip";

describe("zipTextFiles", () => {
  it("starts with the local file header signature PK\\x03\\x04 (PKWARE APPNOTE §4.3.7)", () => {
    const zip = zipTextFiles([{ name: "a.qasm", text: "OPENQASM 2.0;" }]);
    expect([...zip.slice(0, 4)]).toEqual([0x50, 0x4b, 0x03, 0x04]);
  });
  it("is read back file by file by Python's zipfile module (outside reader)", () => {
    const files = [
      { name: "setting-0-ZZ.qasm", text: 'OPENQASM 2.0;\ninclude "qelib1.inc";\nqreg q[2];\n' },
      { name: "setting-1-XX.qasm", text: "// ⟨XX⟩ — π/4\n".repeat(50) },
    ];
    const dir = mkdtempSync(join(tmpdir(), "kw-zip-"));
    const file = join(dir, "t.zip");
    writeFileSync(file, zipTextFiles(files));
    const out = execFileSync(
      "python3",
      [
        "-c",
        "import zipfile,json,sys; z=zipfile.ZipFile(sys.argv[1]); assert z.testzip() is None; print(json.dumps({n: z.read(n).decode('utf-8') for n in z.namelist()}))",
        file,
      ],
      { encoding: "utf8" },
    );
    expect(JSON.parse(out)).toEqual(Object.fromEntries(files.map((f) => [f.name, f.text])));
  });
  it("rejects duplicate and unsafe names with a specific error", () => {
    expect(() =>
      zipTextFiles([
        { name: "a", text: "" },
        { name: "a", text: "" },
      ]),
    ).toThrow(/duplicate file name/);
    expect(() => zipTextFiles([{ name: "../evil", text: "" }])).toThrow(ZipInputError);
    expect(() => zipTextFiles([{ name: "/abs", text: "" }])).toThrow(/unsafe file name/);
  });
});
