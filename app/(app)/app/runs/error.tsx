"use client";

import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";

export default function RunsError({
  error,
  reset,
}: {
  error: Error & { digest?: string };
  reset: () => void;
}) {
  return (
    <Alert
      tone="error"
      role="alert"
      title="This page could not be shown"
      actions={
        <Button variant="secondary" size="sm" onClick={reset}>
          Try again
        </Button>
      }
    >
      Something went wrong while loading it{error.digest ? ` (error id ${error.digest})` : ""}. Your
      drafts are kept.
    </Alert>
  );
}
