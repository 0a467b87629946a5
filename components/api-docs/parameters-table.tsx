/** An operation's query, path and idempotency parameters as a table. */
import { Table, TBody, TD, TH, THead, TR } from "@/components/ui/table";
import type { Parameter } from "./openapi-types";
import { view } from "./schema-fields";

/** A parameter's allowed values, or its type. */
function typeOf(p: Parameter): string {
  if (!p.schema) return "";
  const s = view(p.schema);
  if (s.enum) return s.enum.join(" | ");
  return (Array.isArray(s.type) ? s.type.join(" | ") : s.type) ?? "";
}

export function ParametersTable({ params }: { params: Parameter[] }) {
  return (
    <section className="grid gap-2" aria-label="Parameters">
      <h4 className="text-2xs font-semibold tracking-[0.06em] text-ink-3 uppercase">Parameters</h4>
      <Table>
        <THead>
          <TR>
            <TH>Name</TH>
            <TH>In</TH>
            <TH>Type</TH>
            <TH>Description</TH>
          </TR>
        </THead>
        <TBody>
          {params.map((p) => (
            <TR key={`${p.in}-${p.name}`}>
              <TD className="font-mono text-[12px]">
                {p.name}
                {p.required ? (
                  <span className="ml-1.5 text-[10.5px] font-semibold text-danger">required</span>
                ) : null}
              </TD>
              <TD className="text-[12.5px] text-ink-2">{p.in}</TD>
              <TD className="font-mono text-[12px] text-ink-2">{typeOf(p)}</TD>
              <TD className="text-[12.5px] text-ink-2">{p.description}</TD>
            </TR>
          ))}
        </TBody>
      </Table>
    </section>
  );
}
