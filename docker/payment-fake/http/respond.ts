/** Small helpers to read request bodies and write JSON, HTML, PDF and redirects. */
import type { IncomingMessage, ServerResponse } from "node:http";

const MAX_BODY = 1024 * 1024;

export class BodyTooLargeError extends Error {}

export async function readBody(req: IncomingMessage): Promise<string> {
  const chunks: Buffer[] = [];
  let size = 0;
  for await (const chunk of req) {
    size += (chunk as Buffer).length;
    if (size > MAX_BODY) throw new BodyTooLargeError("Request body is larger than 1 MiB.");
    chunks.push(chunk as Buffer);
  }
  return Buffer.concat(chunks).toString("utf8");
}

export function sendJson(
  res: ServerResponse,
  status: number,
  body: unknown,
  headers: Record<string, string> = {},
): void {
  const text = typeof body === "string" ? body : JSON.stringify(body, null, 2);
  res.writeHead(status, {
    "Content-Type": "application/json; charset=utf-8",
    "Content-Length": Buffer.byteLength(text),
    "Cache-Control": "no-cache, no-store",
    ...headers,
  });
  res.end(text);
}

export function sendHtml(res: ServerResponse, status: number, html: string): void {
  res.writeHead(status, {
    "Content-Type": "text/html; charset=utf-8",
    "Content-Length": Buffer.byteLength(html),
    "Cache-Control": "no-store",
  });
  res.end(html);
}

export function sendPdf(res: ServerResponse, pdf: Buffer, filename: string): void {
  res.writeHead(200, {
    "Content-Type": "application/pdf",
    "Content-Length": pdf.length,
    "Content-Disposition": `inline; filename="${filename}"`,
  });
  res.end(pdf);
}

export function redirect(res: ServerResponse, location: string): void {
  res.writeHead(303, { Location: location, "Content-Length": 0 });
  res.end();
}
