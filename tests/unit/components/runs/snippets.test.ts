import { execFileSync } from "node:child_process";
import { mkdtempSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import ts from "typescript";
import { describe, expect, it } from "vitest";
import { reproductionSnippets, toPython } from "@/components/runs/snippets";

const body = {
  name: "Bell 'pair' — ZZ + XX",
  circuit: {
    format: "qasm2",
    source:
      'OPENQASM 2.0;\ninclude "qelib1.inc";\nqreg q[2];\nh q[0];\ncx q[0],q[1];\n// \\ backslash and """ quotes\n',
  },
  observable: { format: "pauli", terms: "Z0 Z1 + 0.5 X0 X1" },
  shots: 4000,
  seed: 12345,
  mitigateReadout: false,
  noise: { readout: { p1Given0: 0.02 } },
  sweep: { theta: [0, 0.5, 1e-7] },
};

const dir = mkdtempSync(join(tmpdir(), "kw-snip-"));
const write = (name: string, text: string) => {
  const p = join(dir, name);
  writeFileSync(p, text, "utf8");
  return p;
};

describe("reproduction snippets", () => {
  const s = reproductionSnippets("http://localhost:3000/", body);

  it("curl: valid bash (bash -n) whose here-document is exactly the request JSON", () => {
    const file = write("run.sh", s.curl);
    execFileSync("bash", ["-n", file]);
    // Run the here-document through cat instead of curl and compare the JSON.
    const out = execFileSync(
      "bash",
      [
        "-c",
        s.curl
          .split("\n")
          .slice(4)
          .join("\n")
          .replace(/^ {2}--data @- /m, "cat ")
          .split("\n# Poll")[0],
      ],
      {
        encoding: "utf8",
      },
    );
    expect(JSON.parse(out)).toEqual(body);
  });

  it("Python: compiles, and the body literal evaluates to the same object (python3 ast.literal_eval)", () => {
    const file = write("run.py", s.python);
    execFileSync("python3", ["-m", "py_compile", file]);
    const literal = write("body.py", toPython(body));
    const out = execFileSync(
      "python3",
      [
        "-c",
        "import ast,json,sys; print(json.dumps(ast.literal_eval(open(sys.argv[1], encoding='utf-8').read())))",
        literal,
      ],
      {
        encoding: "utf8",
      },
    );
    expect(JSON.parse(out)).toEqual(body);
  });

  it("TypeScript: parses without syntax errors (TypeScript compiler API)", () => {
    const out = ts.transpileModule(s.typescript, {
      reportDiagnostics: true,
      compilerOptions: { target: ts.ScriptTarget.ES2022, module: ts.ModuleKind.ESNext },
    });
    expect(out.diagnostics ?? []).toEqual([]);
    expect(s.typescript).toContain(JSON.stringify(body, null, 2));
  });

  it("never embeds a key and uses the origin without a trailing slash", () => {
    for (const text of Object.values(s)) {
      expect(text).toContain("KETWISE_API_KEY");
      expect(text).not.toMatch(/kw_[A-Za-z0-9]/);
      expect(text).toContain("http://localhost:3000");
      expect(text).not.toContain("3000/api/v1/runs".replace("/api", "//api"));
      expect(text).toMatch(/api\/v1\/runs/);
    }
  });
});
