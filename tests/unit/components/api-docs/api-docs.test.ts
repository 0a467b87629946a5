import { execFileSync } from "node:child_process";
import { mkdtempSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import ts from "typescript";
import { describe, expect, it } from "vitest";
import { operationExamples } from "@/components/api-docs/examples";
import {
  listOperations,
  requestBody,
  type SchemaComponents,
} from "@/components/api-docs/openapi-types";
import { schemaFields } from "@/components/api-docs/schema-fields";
import { getOpenApiDocument } from "@/lib/openapi/document";

const dir = mkdtempSync(join(tmpdir(), "kw-docs-"));
const write = (name: string, text: string) => {
  const p = join(dir, name);
  writeFileSync(p, text, "utf8");
  return p;
};

describe("operationExamples", () => {
  const body = {
    name: "x",
    circuit: { format: "qasm2", source: 'OPENQASM 2.0;\ninclude "qelib1.inc";\nqreg q[1];\n' },
    shots: 10,
  };
  const cases = [
    { method: "post", path: "/api/v1/runs", body, headers: { "Idempotency-Key": "abc-1" } },
    { method: "get", path: "/api/v1/runs/{id}" },
    { method: "delete", path: "/api/v1/circuits/{id}" },
  ];
  for (const c of cases) {
    it(`${c.method.toUpperCase()} ${c.path}: bash -n, python3 py_compile and the TypeScript parser accept the snippets`, () => {
      const s = operationExamples({ ...c, baseUrl: "http://localhost:3000" });
      execFileSync("bash", ["-n", write("a.sh", s.curl)]);
      execFileSync("python3", ["-m", "py_compile", write("a.py", s.python)]);
      const out = ts.transpileModule(s.typescript, {
        reportDiagnostics: true,
        compilerOptions: { target: ts.ScriptTarget.ES2022, module: ts.ModuleKind.ESNext },
      });
      expect(out.diagnostics ?? []).toEqual([]);
    });
  }
  it("sends the body as the here-document (curl) verbatim", () => {
    const s = operationExamples({
      method: "post",
      path: "/api/v1/runs",
      baseUrl: "http://x",
      body,
    });
    const doc = s.curl.split("<<'JSON'\n")[1].split("\nJSON")[0];
    expect(JSON.parse(doc)).toEqual(body);
  });
});

describe("schemaFields on the generated OpenAPI document (lib/openapi)", () => {
  const doc = getOpenApiDocument("http://localhost:3000");
  it("lists the run request's fields with their required flags and the observable alternatives", () => {
    const runs = listOperations(doc).find((o) => o.method === "post" && o.path === "/api/v1/runs");
    const schema = requestBody(runs!.op)!.content["application/json"].schema!;
    const rows = schemaFields(schema, doc.components!.schemas!);
    const byPath = new Map(rows.map((r) => [r.path, r]));
    expect(byPath.get("circuit")?.required).toBe(true);
    expect(byPath.get("circuit.source")?.type).toBe("string");
    expect(byPath.get("shots")?.required).toBe(false);
    expect(rows.some((r) => r.path.startsWith('observable (format="pauli").terms'))).toBe(true);
    expect(rows.some((r) => r.path.startsWith('observable (format="matrix").real'))).toBe(true);
    expect(byPath.get("method")?.values).toContain('"density_matrix"');
  });
  it("follows $ref once and stops on cycles", () => {
    const components: SchemaComponents = {
      Node: {
        type: "object",
        properties: { child: { $ref: "#/components/schemas/Node" }, v: { type: "number" } },
      },
    };
    const rows = schemaFields({ $ref: "#/components/schemas/Node" }, components);
    expect(rows.map((r) => r.path)).toEqual(["child", "v"]);
    expect(rows[0].type).toBe("Node");
  });
});
