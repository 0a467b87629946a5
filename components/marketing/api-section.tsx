import { CodeBlock } from "@/components/ui/code-block";
import { Section } from "./section";

const submit = `# bell.qasm holds the circuit; jq builds the JSON body
jq -n --rawfile src bell.qasm '{
  name: "bell-correlator",
  circuit: { format: "qasm2", source: $src },
  observable: { format: "pauli", terms: "Z0 Z1 + 0.5 X0 X1" },
  shots: 4096,
  seed: 7
}' |
curl https://ketwise.example/api/v1/runs \\
  -H "Authorization: Bearer $KETWISE_KEY" \\
  -H "Content-Type: application/json" \\
  -H "Idempotency-Key: ci-4711" \\
  --data @-`;

const poll = `# 202 Accepted, Location: /api/v1/runs/<id>
curl https://ketwise.example/api/v1/runs/<id> \\
  -H "Authorization: Bearer $KETWISE_KEY"

# { "status": "succeeded",
#   "result": {
#     "ideal":   { "value": 1.5 },
#     "sampled": { "mean": …, "stdErr": …,
#                  "ci95": [ …, … ] } } }`;

/** REST API for notebooks and CI. */
export function ApiSection() {
  return (
    <Section
      id="api"
      eyebrow="REST API"
      title="The same runs from a notebook or a CI job"
      lead="Organisation-scoped API keys, JSON in and out, errors as problem+json with the exact field and line that failed. Submit, poll until the run is finished, and assert on the interval in your tests."
    >
      <div className="grid gap-6 lg:grid-cols-[minmax(0,1.25fr)_minmax(0,1fr)]">
        <CodeBlock title="submit.sh" code={submit} />
        <div className="grid content-start gap-6">
          <CodeBlock title="poll.sh" code={poll} />
          <ul className="grid gap-2 text-sm text-ink-2">
            {[
              "OpenAPI 3.1 document generated from the same schemas the forms use",
              "Idempotency keys so a retried CI step never submits twice",
              "Preview endpoint: qubits, settings and shot plan without running anything",
            ].map((t) => (
              <li key={t} className="grid grid-cols-[auto_1fr] gap-2.5 leading-6">
                <span aria-hidden className="mt-3 h-px w-2.5 bg-accent" />
                {t}
              </li>
            ))}
          </ul>
        </div>
      </div>
    </Section>
  );
}
