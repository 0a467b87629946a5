/** The invoice as a PDF: header, parties, dates, line table and totals. */
import type { Fake } from "../core/fake";
import type { InvoiceRec } from "../core/state";
import { formatCents, formatDate } from "../billing/money";
import { buildPdf, type PdfRule, type PdfText } from "./pdf";

function clip(text: string, max: number): string {
  return text.length > max ? `${text.slice(0, max - 3)}...` : text;
}

export function invoicePdf(fake: Fake, inv: InvoiceRec): Buffer {
  const customer = fake.state.customers[inv.customer];
  const money = (c: number) => formatCents(c, inv.currency);
  const texts: PdfText[] = [
    { x: 50, y: 790, text: "Invoice", size: 22, bold: true },
    { x: 50, y: 768, text: `Number ${inv.number ?? "(draft)"}` },
    { x: 50, y: 754, text: `Status ${inv.status}` },
    { x: 50, y: 740, text: `Issued ${formatDate(inv.finalized_at ?? inv.created)}` },
    { x: 330, y: 790, text: "Ketwise (local test provider)", bold: true },
    { x: 330, y: 776, text: "Test mode - not a tax document" },
    { x: 50, y: 710, text: "Bill to", bold: true },
    { x: 50, y: 696, text: customer?.name ?? "" },
    { x: 50, y: 682, text: inv.customer_email ?? "" },
    { x: 50, y: 650, text: "Description", bold: true, size: 9 },
    { x: 390, y: 650, text: "Qty", bold: true, size: 9 },
    { x: 470, y: 650, text: "Amount", bold: true, size: 9 },
  ];
  const rules: PdfRule[] = [{ x1: 50, y1: 644, x2: 545, y2: 644 }];
  let y = 628;
  for (const line of inv.lines.slice(0, 24)) {
    texts.push({ x: 50, y, text: clip(line.description, 62), size: 9 });
    texts.push({
      x: 50,
      y: y - 11,
      text: `${formatDate(line.period_start)} - ${formatDate(line.period_end)}`,
      size: 7,
    });
    texts.push({ x: 390, y, text: line.quantity.toLocaleString("en-US"), size: 9 });
    texts.push({ x: 470, y, text: money(line.amount), size: 9 });
    y -= 28;
  }
  if (inv.lines.length > 24)
    texts.push({ x: 50, y, text: `... and ${inv.lines.length - 24} more lines`, size: 9 });
  rules.push({ x1: 330, y1: y + 8, x2: 545, y2: y + 8 });
  const totals: [string, number][] = [
    ["Subtotal", inv.subtotal],
    ["Total", inv.total],
    ["Applied balance", inv.starting_balance],
    ["Amount paid", inv.amount_paid],
    ["Amount due", inv.amount_remaining],
  ];
  for (const [label, value] of totals) {
    y -= 16;
    texts.push({ x: 330, y, text: label, bold: label === "Amount due" });
    texts.push({ x: 470, y, text: money(value), bold: label === "Amount due" });
  }
  return buildPdf(`Invoice ${inv.number ?? inv.id}`, texts, rules);
}
