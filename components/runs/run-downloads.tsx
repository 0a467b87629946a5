"use client";
/**
 * Downloads of a run: the whole run as JSON (built here from the run resource), and
 * the per-term table, the counts and the measurement circuits fetched from the API
 * exports (`/api/v1/runs/:id/terms.csv|counts.csv|circuits.zip`, lib/export/run-files.ts),
 * so a script and this page always get the same bytes.
 */
import { useState } from "react";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { IconDownload } from "@/components/ui/icons";
import { MIME, downloadBlob } from "@/lib/export/download";
import { fileStem, runJson } from "@/lib/export/run-export";
import { apiFetchFile, isApiError } from "@/lib/swr/api-client";
import { useWorkspaceOrg } from "@/lib/swr/org-context";
import type { Run } from "@/lib/swr/types";

type ExportFile = "terms.csv" | "counts.csv" | "circuits.zip";

export function RunDownloads({ run }: { run: Run }) {
  const { orgId } = useWorkspaceOrg();
  const [busy, setBusy] = useState<ExportFile | null>(null);
  const [message, setMessage] = useState<string | null>(null);
  const stem = fileStem(run.name, run.id);
  const result = run.result;
  const hasCounts = !!result?.groups.some((g) => g.counts && Object.keys(g.counts).length);

  const download = async (file: ExportFile) => {
    setBusy(file);
    setMessage(null);
    try {
      const { bytes, type, fileName } = await apiFetchFile(orgId, `/api/v1/runs/${run.id}/${file}`);
      downloadBlob(bytes, fileName ?? `${stem}-${file}`, type);
    } catch (error) {
      setMessage(isApiError(error) ? error.message : "The file could not be downloaded.");
    } finally {
      setBusy(null);
    }
  };

  const exportButton = (file: ExportFile, label: string) => (
    <Button
      variant="secondary"
      size="sm"
      icon={<IconDownload />}
      loading={busy === file}
      onClick={() => download(file)}
    >
      {label}
    </Button>
  );

  return (
    <div className="grid gap-3">
      <div className="flex flex-wrap gap-2">
        <Button
          variant="secondary"
          size="sm"
          icon={<IconDownload />}
          onClick={() => downloadBlob(runJson(run), `${stem}.json`, MIME.json)}
        >
          Run (JSON)
        </Button>
        {result ? exportButton("terms.csv", "Terms (CSV)") : null}
        {hasCounts && result ? exportButton("counts.csv", "Counts (CSV)") : null}
        {result ? exportButton("circuits.zip", "Measurement circuits (zip)") : null}
      </div>
      {message ? (
        <Alert tone="warning" compact role="status">
          {message}
        </Alert>
      ) : null}
    </div>
  );
}
