"use client";
/**
 * Downloads of a run: the whole run as JSON, the per-term table and the counts as CSV,
 * and the measurement circuits (one OpenQASM file per setting) as a zip built in the
 * browser with fflate.
 */
import { useState } from "react";
import { measurementCircuitsAction } from "@/app/(app)/app/runs/[id]/actions";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { IconDownload } from "@/components/workspace/icons";
import { MIME, downloadBlob } from "@/lib/export/download";
import { countsCsv, fileStem, runJson, termsCsv } from "@/lib/export/run-export";
import { zipTextFiles } from "@/lib/export/zip";
import type { Run } from "@/lib/swr/types";

export function RunDownloads({ run }: { run: Run }) {
  const [busy, setBusy] = useState(false);
  const [message, setMessage] = useState<string | null>(null);
  const stem = fileStem(run.name, run.id);
  const result = run.result;
  const hasCounts = !!result?.groups.some((g) => g.counts && Object.keys(g.counts).length);

  const zip = async () => {
    setBusy(true);
    setMessage(null);
    try {
      const answer = await measurementCircuitsAction(run.id);
      if (!answer.ok) {
        setMessage(answer.message);
        return;
      }
      const readme = {
        name: "README.txt",
        text:
          `Measurement circuits of Ketwise run ${run.id} (${run.name}).\n` +
          `One OpenQASM 2.0 file per measurement setting; the file name carries the setting's bases, qubit 0 first.\n` +
          `Each circuit prepares the run's state, rotates every measured qubit into its basis (X: h; Y: sdg then h) and measures it.\n`,
      };
      const bytes = zipTextFiles([readme, ...answer.files]);
      downloadBlob(bytes.slice().buffer, `${stem}-circuits.zip`, MIME.zip);
    } finally {
      setBusy(false);
    }
  };

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
        {result ? (
          <Button
            variant="secondary"
            size="sm"
            icon={<IconDownload />}
            onClick={() => downloadBlob(termsCsv(result), `${stem}-terms.csv`, MIME.csv)}
          >
            Terms (CSV)
          </Button>
        ) : null}
        {hasCounts && result ? (
          <Button
            variant="secondary"
            size="sm"
            icon={<IconDownload />}
            onClick={() => downloadBlob(countsCsv(result), `${stem}-counts.csv`, MIME.csv)}
          >
            Counts (CSV)
          </Button>
        ) : null}
        {result ? (
          <Button
            variant="secondary"
            size="sm"
            icon={<IconDownload />}
            loading={busy}
            onClick={zip}
          >
            Measurement circuits (zip)
          </Button>
        ) : null}
      </div>
      {message ? (
        <Alert tone="warning" compact role="status">
          {message}
        </Alert>
      ) : null}
    </div>
  );
}
