/** The conventions that hold for every operation of the API. */
import { Card, CardBody } from "@/components/ui/card";

export function Conventions({ baseUrl }: { baseUrl: string }) {
  return (
    <Card>
      <CardBody className="grid gap-3 pt-5 text-[13px] leading-6 text-ink-2">
        <h2 className="text-[15px] font-semibold text-ink">How the API works</h2>
        <ul className="grid list-disc gap-1.5 pl-5">
          <li>
            Base URL <code className="font-mono text-[12px] text-ink">{baseUrl}</code>. Authenticate
            with an organisation API key:{" "}
            <code className="font-mono text-[12px] text-ink">Authorization: Bearer kw_…</code>{" "}
            (create one under API keys; it is shown once).
          </li>
          <li>
            Runs are asynchronous: POST answers 202 with the queued run; then{" "}
            <code className="font-mono text-[12px] text-ink">
              GET /api/v1/runs/{"{id}"}?wait=30
            </code>{" "}
            holds the answer until the run is succeeded, failed or canceled (at most 30 s; ask again
            if it is still running) — no polling loop needed.
          </li>
          <li>
            Every answer carries{" "}
            <code className="font-mono text-[12px] text-ink">
              RateLimit-Limit, RateLimit-Remaining, RateLimit-Reset, RateLimit-Policy
            </code>{" "}
            (IETF draft-ietf-httpapi-ratelimit-headers-06); a 429 adds Retry-After. Pace yourself by
            them.
          </li>
          <li>
            A succeeded run’s files — terms.csv, counts.csv, points.csv, circuits.zip — are under{" "}
            <code className="font-mono text-[12px] text-ink">/api/v1/runs/{"{id}"}/</code>, the same
            bytes as the run page’s downloads.
          </li>
          <li>
            Send an <code className="font-mono text-[12px] text-ink">Idempotency-Key</code> header
            to make retries of a submission safe.
          </li>
          <li>
            Lists are newest first and paginated: pass the previous page’s nextCursor as cursor.
          </li>
          <li>
            Errors are RFC 9457 problem documents (
            <code className="font-mono text-[12px] text-ink">application/problem+json</code>) with
            field paths, and line/column for circuit and observable text. A run of another
            organisation answers 404.
          </li>
          <li>Qubit 0 is written first in Pauli words and bitstrings; angles are in radians.</li>
        </ul>
      </CardBody>
    </Card>
  );
}
