/** The API reference's side navigation: operations by group, and the downloads. */
import { anchor, groupOf, type ListedOperation } from "./openapi-types";

export function OperationsNav({ ops, groups }: { ops: ListedOperation[]; groups: string[] }) {
  return (
    <nav aria-label="Operations" className="xl:sticky xl:top-4 xl:self-start">
      <ul className="grid gap-3 text-[13px]">
        {groups.map((g) => (
          <li key={g}>
            <p className="mb-1 text-2xs font-semibold tracking-[0.06em] text-ink-3 uppercase">
              {g}
            </p>
            <ul className="grid gap-0.5">
              {ops
                .filter((o) => groupOf(o) === g)
                .map((o) => (
                  <li key={`${o.method}${o.path}`}>
                    <a
                      href={`#${anchor(o.method, o.path)}`}
                      className="flex items-center gap-2 rounded px-1 py-0.5 hover:bg-surface-2"
                    >
                      <span className="w-12 font-mono text-[10.5px] font-semibold text-ink-3 uppercase">
                        {o.method}
                      </span>
                      <span className="truncate font-mono text-[11.5px] text-ink-2">
                        {o.path.replace("/api/v1", "")}
                      </span>
                    </a>
                  </li>
                ))}
            </ul>
          </li>
        ))}
        <li>
          <a
            href="/api/v1/openapi.json"
            className="text-[12.5px] font-medium text-accent-ink underline"
          >
            openapi.json
          </a>
        </li>
        <li>
          <a
            href="/clients/ketwise.py"
            download
            className="text-[12.5px] font-medium text-accent-ink underline"
          >
            ketwise.py (Python client)
          </a>
        </li>
      </ul>
    </nav>
  );
}
