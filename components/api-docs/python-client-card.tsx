/**
 * The shipped Python client on the API reference page: a link to download
 * `/clients/ketwise.py` (one file, standard library only) and a short example of an
 * optimiser-style loop with it.
 */
import { Card, CardBody } from "@/components/ui/card";
import { CodeBlock } from "@/components/ui/code-block";

export const PYTHON_CLIENT_PATH = "/clients/ketwise.py";

function example(baseUrl: string): string {
  return [
    "from ketwise import Client   # ketwise.py next to your notebook",
    "",
    `kw = Client("${baseUrl}", "kw_…")   # or KETWISE_URL / KETWISE_API_KEY`,
    'qasm = """OPENQASM 3.0;',
    'include "stdgates.inc";',
    "input float[64] t;",
    "qubit[2] q;",
    "ry(t) q[0];",
    "cx q[0], q[1];",
    '"""',
    'result = kw.run(qasm, "Z0 Z1 + 0.5 X0", parameters={"t": 0.3}, shots=2000, seed=7)',
    'print(result["exact"]["value"], result["sampled"]["mean"], result["sampled"]["stdErr"])',
    "",
    "# Many points in one run (one call), each with its gradient:",
    'for p in kw.points(qasm, "Z0 Z1 + 0.5 X0", [{"t": 0.1}, {"t": 0.2}], gradient=True):',
    '    print(p["params"], p["exact"], p["gradient"]["t"]["exact"])',
  ].join("\n");
}

export function PythonClientCard({ baseUrl }: { baseUrl: string }) {
  return (
    <Card id="python-client" className="scroll-mt-20">
      <CardBody className="grid gap-3 pt-5 text-[13px] leading-6 text-ink-2">
        <h2 className="text-[15px] font-semibold text-ink">Python client</h2>
        <p className="max-w-3xl">
          <a href={PYTHON_CLIENT_PATH} download className="font-medium text-accent-ink underline">
            ketwise.py
          </a>{" "}
          is a single file that needs nothing but Python 3.8+ and its standard library. It submits
          with an Idempotency-Key, waits with <code className="font-mono">?wait</code> instead of
          polling, retries 429 and 503 after Retry-After, keeps the RateLimit fields, and raises
          typed errors (<code className="font-mono">BadRequest</code>,{" "}
          <code className="font-mono">ValidationFailed</code>,{" "}
          <code className="font-mono">RateLimited</code>,{" "}
          <code className="font-mono">RunFailed</code>, …) carrying the problem’s status, type,
          title, detail and field errors. Helpers: <code className="font-mono">submit</code>,{" "}
          <code className="font-mono">wait</code>, <code className="font-mono">result</code>,{" "}
          <code className="font-mono">run</code>, <code className="font-mono">points</code>,{" "}
          <code className="font-mono">gradient</code>, <code className="font-mono">download</code>.
        </p>
        <CodeBlock code={example(baseUrl)} title="Python" maxHeight="24rem" />
      </CardBody>
    </Card>
  );
}
