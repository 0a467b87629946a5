/**
 * Browser download of generated content (client only): a Blob behind a temporary
 * object URL on an <a download>, revoked after the click.
 */
export const MIME = {
  json: "application/json",
  csv: "text/csv;charset=utf-8",
  zip: "application/zip",
  qasm: "text/plain;charset=utf-8",
} as const;

export function downloadBlob(data: BlobPart, fileName: string, type: string): void {
  const url = URL.createObjectURL(new Blob([data], { type }));
  const a = document.createElement("a");
  a.href = url;
  a.download = fileName;
  a.rel = "noopener";
  document.body.appendChild(a);
  a.click();
  a.remove();
  setTimeout(() => URL.revokeObjectURL(url), 1_000);
}
