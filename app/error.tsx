"use client";

import { useEffect } from "react";
import { StatusPage } from "@/components/shell/status-page";
import { Button, buttonClasses } from "@/components/ui/button";
import { CopyButton } from "@/components/ui/copy-button";

/**
 * Error boundary for every route below the root layout. Shows a generic message (server
 * errors never reach the browser in detail) and the digest that matches the server log.
 */
export default function ErrorPage({ error, retry }: { error: unknown; retry: () => void }) {
  const digest =
    error instanceof Error && "digest" in error && typeof error.digest === "string"
      ? error.digest
      : undefined;
  useEffect(() => {
    console.error(error);
  }, [error]);

  return (
    <StatusPage
      code="error"
      title="Something went wrong on our side"
      actions={
        <>
          <Button onClick={() => retry()}>Try again</Button>
          <a href="/app" className={buttonClasses({ variant: "secondary" })}>
            Go to the dashboard
          </a>
        </>
      }
      detail={
        digest ? (
          <span className="flex flex-wrap items-center gap-2">
            Error reference{" "}
            <code className="figures rounded bg-surface-2 px-1.5 py-0.5 text-ink-2">{digest}</code>
            <CopyButton text={digest} label="Copy error reference" />
          </span>
        ) : (
          "If this keeps happening, note the time and what you were doing when you contact us."
        )
      }
    >
      The request failed unexpectedly. Try again; if it fails a second time, quote the reference
      below so the error can be found in the logs.
    </StatusPage>
  );
}
