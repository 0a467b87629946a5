import { Card, CardBody } from "@/components/ui/card";
import { Table, TBody, TD, TH, THead, TR } from "@/components/ui/table";
import { gateReference, STATEMENTS } from "@/lib/quantum/circuit/gate-reference";

/**
 * The circuit language reference (gates, statements, modifiers), generated from the
 * engine's gate tables — the same rows as the table in README.md. Server component.
 */
export function GateTable() {
  const gates = gateReference();
  return (
    <Card id="circuit-language" className="scroll-mt-20">
      <CardBody className="grid gap-4 pt-5 text-[13px] leading-6 text-ink-2">
        <div className="grid gap-1">
          <h2 className="text-[15px] font-semibold text-ink">
            Circuit language: gates and statements
          </h2>
          <p>
            OpenQASM 2.0 in full and the OpenQASM 3 statements below. Angles are in radians;
            controls come first. Generated from the engine’s gate library.
          </p>
        </div>
        <Table aria-label="Supported gates">
          <THead>
            <TR>
              <TH>Gate</TH>
              <TH>OpenQASM 2.0</TH>
              <TH>OpenQASM 3</TH>
              <TH>Definition</TH>
            </TR>
          </THead>
          <TBody>
            {gates.map((g) => (
              <TR key={g.name}>
                <TD className="font-mono text-[12px] whitespace-nowrap text-ink">{g.signature}</TD>
                <TD>{g.qasm2 ?? "—"}</TD>
                <TD>{g.qasm3 ?? "—"}</TD>
                <TD>{g.definition}</TD>
              </TR>
            ))}
          </TBody>
        </Table>
        <Table aria-label="Supported statements">
          <THead>
            <TR>
              <TH>Statement</TH>
              <TH>Dialect</TH>
              <TH>Meaning</TH>
            </TR>
          </THead>
          <TBody>
            {STATEMENTS.map((s) => (
              <TR key={s.statement}>
                <TD className="font-mono text-[12px] text-ink">{s.statement}</TD>
                <TD className="whitespace-nowrap">{s.dialects}</TD>
                <TD>{s.meaning}</TD>
              </TR>
            ))}
          </TBody>
        </Table>
      </CardBody>
    </Card>
  );
}
