/**
 * Request examples of one API operation in curl, Python `requests` and TypeScript
 * `fetch`, with the key read from KETWISE_API_KEY. Path parameters stay as shell /
 * language variables (RUN_ID, …) so the snippets run after setting them.
 */
import { toPython } from "@/components/runs/snippets";

export type ExampleInput = {
  method: string;
  path: string;
  baseUrl: string;
  body?: unknown;
  headers?: Record<string, string>;
  /** The success answer is a file (CSV, zip): the snippets save it under this name. */
  download?: string;
};

const varName = (p: string) => `${p.replace(/[^A-Za-z0-9]/g, "_").toUpperCase()}`;

export function operationExamples({
  method,
  path,
  baseUrl,
  body,
  headers = {},
  download,
}: ExampleInput) {
  const M = method.toUpperCase();
  const base = baseUrl.replace(/\/+$/, "");
  const params = [...path.matchAll(/\{([^}]+)\}/g)].map((m) => m[1]);
  const shellPath = path.replace(
    /\{([^}]+)\}/g,
    (_, p: string) => `$${varName(p === "id" ? "run_id" : p)}`,
  );
  const pyPath = path.replace(/\{([^}]+)\}/g, (_, p: string) => `{${p === "id" ? "run_id" : p}}`);
  const tsPath = path.replace(/\{([^}]+)\}/g, (_, p: string) => `\${${p === "id" ? "runId" : p}}`);
  const hasBody = body !== undefined;
  const json = hasBody ? JSON.stringify(body, null, 2) : "";
  const extra = Object.entries(headers);

  const curl = [
    ...params.map(
      (p) => `${varName(p === "id" ? "run_id" : p)}=...   # the id from an earlier answer`,
    ),
    `curl -sS -X ${M} "${base}${shellPath}"${download ? ` -o ${download}` : ""} \\`,
    `  -H "Authorization: Bearer $KETWISE_API_KEY"${hasBody || extra.length ? " \\" : ""}`,
    ...extra.map(([k, v], i) => `  -H "${k}: ${v}"${hasBody || i < extra.length - 1 ? " \\" : ""}`),
    ...(hasBody
      ? [`  -H "Content-Type: application/json" \\`, `  --data @- <<'JSON'`, json, "JSON"]
      : []),
    "",
  ].join("\n");

  const python = [
    "import os",
    "import requests",
    "",
    `BASE = ${JSON.stringify(base)}`,
    `headers = {"Authorization": f"Bearer {os.environ['KETWISE_API_KEY']}"${extra.map(([k, v]) => `, ${JSON.stringify(k)}: ${JSON.stringify(v)}`).join("")}}`,
    ...params.map((p) => `${p === "id" ? "run_id" : p} = "..."  # the id from an earlier answer`),
    ...(hasBody ? ["", `body = ${toPython(body)}`, ""] : [""]),
    `response = requests.request(${JSON.stringify(M)}, f"{BASE}${pyPath}", headers=headers${hasBody ? ", json=body" : ""}, timeout=30)`,
    ...(download
      ? [
          "response.raise_for_status()",
          `open(${JSON.stringify(download)}, "wb").write(response.content)`,
        ]
      : ["print(response.status_code, response.json() if response.content else None)"]),
    "",
  ].join("\n");

  const typescript = [
    `const BASE = ${JSON.stringify(base)};`,
    ...params.map(
      (p) => `const ${p === "id" ? "runId" : p} = "..."; // the id from an earlier answer`,
    ),
    ...(hasBody ? [`const body = ${json};`] : []),
    `const response = await fetch(\`\${BASE}${tsPath}\`, {`,
    `  method: ${JSON.stringify(M)},`,
    `  headers: {`,
    `    Authorization: \`Bearer \${process.env.KETWISE_API_KEY}\`,`,
    ...extra.map(([k, v]) => `    ${JSON.stringify(k)}: ${JSON.stringify(v)},`),
    ...(hasBody ? [`    "Content-Type": "application/json",`] : []),
    `  },`,
    ...(hasBody ? [`  body: JSON.stringify(body),`] : []),
    `});`,
    ...(download
      ? [
          `if (!response.ok) throw new Error(JSON.stringify(await response.json()));`,
          `await (await import("node:fs/promises")).writeFile(${JSON.stringify(download)}, new Uint8Array(await response.arrayBuffer()));`,
        ]
      : [`console.log(response.status, response.status === 204 ? null : await response.json());`]),
    "",
  ].join("\n");

  return { curl, python, typescript };
}
