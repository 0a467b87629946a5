/** The request fields of an operation as a table (nested fields indented). */
import { Table, TBody, TD, TH, THead, TR } from "@/components/ui/table";
import type { JsonSchema, SchemaComponents } from "./openapi-types";
import { refName, schemaFields } from "./schema-fields";

export function FieldsTable({
  schema,
  components,
  label,
}: {
  schema: JsonSchema;
  components: SchemaComponents;
  label: string;
}) {
  const rows = schemaFields(schema, components);
  if (!rows.length)
    return (
      <p className="text-[13px] text-ink-2">{schema.$ref ? refName(schema.$ref) : "No fields."}</p>
    );
  return (
    <Table aria-label={label}>
      <THead>
        <TR>
          <TH>Field</TH>
          <TH>Type</TH>
          <TH>Description</TH>
        </TR>
      </THead>
      <TBody>
        {rows.map((r, i) => (
          <TR key={`${r.path}-${i}`}>
            <TD className="align-top whitespace-nowrap">
              <span
                className="font-mono text-[12px] text-ink"
                style={{ paddingLeft: `${Math.max(0, r.path.split(".").length - 1) * 0.5}rem` }}
              >
                {r.path}
              </span>
              {r.required ? (
                <span className="ml-1.5 text-[10.5px] font-semibold text-danger">required</span>
              ) : null}
            </TD>
            <TD className="align-top font-mono text-[12px] text-ink-2">{r.type}</TD>
            <TD className="align-top text-[12.5px] leading-5 text-ink-2">
              {r.description}
              {r.values ? (
                <span className="block font-mono text-[11.5px] text-ink-3">{r.values}</span>
              ) : null}
            </TD>
          </TR>
        ))}
      </TBody>
    </Table>
  );
}
