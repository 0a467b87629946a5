/**
 * A minimal one-page PDF 1.4 written by hand: catalog → pages → page with
 * the two built-in Helvetica fonts (no embedding needed), one content
 * stream of positioned text and rules, an info dictionary and a byte-exact
 * cross-reference table. Text is WinAnsi (Latin-1); other characters become "?".
 */
export interface PdfText {
  x: number;
  y: number;
  text: string;
  size?: number;
  bold?: boolean;
}

export interface PdfRule {
  x1: number;
  y1: number;
  x2: number;
  y2: number;
}

function pdfString(text: string): string {
  const latin1 = Array.from(text, (ch) =>
    ch.charCodeAt(0) <= 0xff ? ch : ch === "\u2212" ? "-" : "?",
  ).join("");
  return `(${latin1
    .replace(/\\/g, "\\\\")
    .replace(/\(/g, "\\(")
    .replace(/\)/g, "\\)")
    .replace(/[\r\n]/g, " ")})`;
}

export function buildPdf(title: string, texts: PdfText[], rules: PdfRule[] = []): Buffer {
  const ops: string[] = ["0.8 0.82 0.8 RG 0.6 w"];
  for (const r of rules) ops.push(`${r.x1} ${r.y1} m ${r.x2} ${r.y2} l S`);
  for (const t of texts) {
    ops.push(
      `BT /${t.bold ? "F2" : "F1"} ${t.size ?? 10} Tf ${t.x} ${t.y} Td ${pdfString(t.text)} Tj ET`,
    );
  }
  const content = ops.join("\n");
  const objects = [
    "<< /Type /Catalog /Pages 2 0 R >>",
    "<< /Type /Pages /Kids [3 0 R] /Count 1 >>",
    "<< /Type /Page /Parent 2 0 R /MediaBox [0 0 595 842] /Resources << /Font << /F1 4 0 R /F2 5 0 R >> >> /Contents 6 0 R >>",
    "<< /Type /Font /Subtype /Type1 /BaseFont /Helvetica /Encoding /WinAnsiEncoding >>",
    "<< /Type /Font /Subtype /Type1 /BaseFont /Helvetica-Bold /Encoding /WinAnsiEncoding >>",
    `<< /Length ${Buffer.byteLength(content, "latin1")} >>\nstream\n${content}\nendstream`,
    `<< /Title ${pdfString(title)} /Producer (Ketwise local payment fake) >>`,
  ];
  let out = "%PDF-1.4\n%\xe2\xe3\xcf\xd3\n";
  const offsets: number[] = [];
  objects.forEach((body, i) => {
    offsets.push(Buffer.byteLength(out, "latin1"));
    out += `${i + 1} 0 obj\n${body}\nendobj\n`;
  });
  const xrefAt = Buffer.byteLength(out, "latin1");
  out += `xref\n0 ${objects.length + 1}\n0000000000 65535 f \n`;
  for (const off of offsets) out += `${String(off).padStart(10, "0")} 00000 n \n`;
  out += `trailer\n<< /Size ${objects.length + 1} /Root 1 0 R /Info ${objects.length} 0 R >>\nstartxref\n${xrefAt}\n%%EOF\n`;
  return Buffer.from(out, "latin1");
}
