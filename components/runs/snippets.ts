/**
 * Reproduction snippets for a run: the exact request body (with the run's seed, so every
 * sampled figure comes out the same) submitted with curl, Python `requests` and
 * TypeScript `fetch`, then polled until the run is terminal. The API key is read from
 * the KETWISE_API_KEY environment variable; nothing secret is embedded.
 */

export type SnippetSet = { curl: string; python: string; typescript: string };

/** A JSON value as a Python literal (JSON string escapes are valid Python escapes). */
export function toPython(value: unknown, indent = 0): string {
  const pad = (n: number) => "    ".repeat(n);
  if (value === null || value === undefined) return "None";
  if (value === true) return "True";
  if (value === false) return "False";
  if (typeof value === "number") return Number.isFinite(value) ? JSON.stringify(value) : "None";
  if (typeof value === "string") return JSON.stringify(value);
  if (Array.isArray(value)) {
    if (value.every((v) => typeof v === "number"))
      return `[${value.map((v) => toPython(v)).join(", ")}]`;
    if (!value.length) return "[]";
    return `[\n${value.map((v) => `${pad(indent + 1)}${toPython(v, indent + 1)}`).join(",\n")},\n${pad(indent)}]`;
  }
  const entries = Object.entries(value as Record<string, unknown>).filter(
    ([, v]) => v !== undefined,
  );
  if (!entries.length) return "{}";
  return `{\n${entries.map(([k, v]) => `${pad(indent + 1)}${JSON.stringify(k)}: ${toPython(v, indent + 1)}`).join(",\n")},\n${pad(indent)}}`;
}

export function reproductionSnippets(origin: string, body: Record<string, unknown>): SnippetSet {
  const base = origin.replace(/\/+$/, "");
  const json = JSON.stringify(body, null, 2);
  const delimiter = json.split("\n").some((l) => l === "KETWISE_RUN")
    ? "KETWISE_RUN_BODY"
    : "KETWISE_RUN";

  const curl = [
    `# Submit (the API answers 202 with the run; its "id" is used below)`,
    `curl -sS -X POST "${base}/api/v1/runs" \\`,
    `  -H "Authorization: Bearer $KETWISE_API_KEY" \\`,
    `  -H "Content-Type: application/json" \\`,
    `  --data @- <<'${delimiter}'`,
    json,
    delimiter,
    ``,
    `# Poll until "status" is succeeded, failed or canceled`,
    `curl -sS "${base}/api/v1/runs/$RUN_ID" -H "Authorization: Bearer $KETWISE_API_KEY"`,
    ``,
  ].join("\n");

  const python = [
    `import os, time`,
    `import requests`,
    ``,
    `BASE = ${JSON.stringify(base)}`,
    `HEADERS = {"Authorization": f"Bearer {os.environ['KETWISE_API_KEY']}"}`,
    ``,
    `body = ${toPython(body)}`,
    ``,
    `run = requests.post(f"{BASE}/api/v1/runs", json=body, headers=HEADERS, timeout=30)`,
    `run.raise_for_status()`,
    `run = run.json()`,
    `while run["status"] in ("queued", "running"):`,
    `    time.sleep(0.5)`,
    `    run = requests.get(f"{BASE}/api/v1/runs/{run['id']}", headers=HEADERS, timeout=30).json()`,
    ``,
    `result = run["result"]`,
    `print(run["status"], result["exact"]["value"], result["sampled"])`,
    ``,
  ].join("\n");

  const typescript = [
    `const BASE = ${JSON.stringify(base)};`,
    `const headers = {`,
    `  Authorization: \`Bearer \${process.env.KETWISE_API_KEY}\`,`,
    `  "Content-Type": "application/json",`,
    `};`,
    ``,
    `const body = ${json.split("\n").join("\n")};`,
    ``,
    `let run = await (await fetch(\`\${BASE}/api/v1/runs\`, { method: "POST", headers, body: JSON.stringify(body) })).json();`,
    `while (run.status === "queued" || run.status === "running") {`,
    `  await new Promise((r) => setTimeout(r, 500));`,
    `  run = await (await fetch(\`\${BASE}/api/v1/runs/\${run.id}\`, { headers })).json();`,
    `}`,
    `console.log(run.status, run.result?.exact.value, run.result?.sampled);`,
    ``,
  ].join("\n");

  return { curl, python, typescript };
}
