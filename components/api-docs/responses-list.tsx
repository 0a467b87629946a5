/** An operation's answers: status, description, media type and schema name. */
import { cn } from "@/components/ui/cn";
import type { Response } from "./openapi-types";
import { refName } from "./schema-fields";

export function ResponsesList({ responses }: { responses: [string, Response][] }) {
  return (
    <section className="grid gap-2" aria-label="Responses">
      <h4 className="text-2xs font-semibold tracking-[0.06em] text-ink-3 uppercase">Responses</h4>
      <ul className="grid gap-1 text-[13px]">
        {responses.map(([status, r]) => {
          const media = r.content ? Object.entries(r.content)[0] : undefined;
          const ref = media?.[1].schema?.$ref;
          return (
            <li key={status} className="flex flex-wrap items-baseline gap-2">
              <span
                className={cn(
                  "figures w-10 font-semibold",
                  status.startsWith("2") ? "text-ok" : "text-danger",
                )}
              >
                {status}
              </span>
              <span className="text-ink-2">{r.description}</span>
              {media ? (
                <span className="font-mono text-[11.5px] text-ink-3">
                  {media[0]}
                  {ref ? ` · ${refName(ref)}` : ""}
                </span>
              ) : null}
            </li>
          );
        })}
      </ul>
    </section>
  );
}
