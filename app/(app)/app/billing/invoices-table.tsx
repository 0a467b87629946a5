import { Badge, type BadgeTone } from "@/components/ui/badge";
import { EmptyState } from "@/components/ui/empty-state";
import { IconExternal } from "@/components/ui/icons";
import { Table, TBody, TD, TH, THead, TR } from "@/components/ui/table";
import type { InvoiceRow } from "@/lib/billing/view";
import { formatDate, formatMoney } from "@/lib/format";

const REASONS: Record<string, string> = {
  subscription_create: "First month",
  subscription_cycle: "Renewal",
  subscription_update: "Plan or seat change",
  manual: "Manual",
};
const STATUS: Record<string, BadgeTone> = {
  paid: "ok",
  open: "warn",
  void: "neutral",
  uncollectible: "danger",
  draft: "neutral",
};

export function InvoicesTable({ invoices }: { invoices: InvoiceRow[] }) {
  if (invoices.length === 0)
    return (
      <EmptyState
        title="No invoices yet"
        description="Invoices appear here after the first payment."
      />
    );
  return (
    <Table>
      <THead>
        <TR>
          <TH>Invoice</TH>
          <TH>Date</TH>
          <TH>For</TH>
          <TH numeric>Total</TH>
          <TH>Status</TH>
          <TH className="text-right">Documents</TH>
        </TR>
      </THead>
      <TBody>
        {invoices.map((i) => (
          <TR key={i.id}>
            <TD className="font-mono text-[12.5px]">{i.number ?? i.id}</TD>
            <TD className="text-ink-2">{formatDate(i.created)}</TD>
            <TD className="text-ink-2">{REASONS[i.reason ?? ""] ?? i.reason ?? "—"}</TD>
            <TD numeric>{formatMoney(i.total, i.currency)}</TD>
            <TD>
              <Badge tone={STATUS[i.status ?? ""] ?? "neutral"}>{i.status ?? "—"}</Badge>
            </TD>
            <TD>
              <div className="flex justify-end gap-3 text-[13px]">
                {i.hostedUrl ? (
                  <a
                    href={i.hostedUrl}
                    target="_blank"
                    rel="noreferrer"
                    className="inline-flex items-center gap-1 font-medium text-accent-ink hover:underline"
                  >
                    View <IconExternal className="size-3.5" />
                  </a>
                ) : null}
                {i.pdfUrl ? (
                  <a
                    href={i.pdfUrl}
                    target="_blank"
                    rel="noreferrer"
                    className="inline-flex items-center gap-1 font-medium text-accent-ink hover:underline"
                  >
                    PDF <IconExternal className="size-3.5" />
                  </a>
                ) : null}
              </div>
            </TD>
          </TR>
        ))}
      </TBody>
    </Table>
  );
}
