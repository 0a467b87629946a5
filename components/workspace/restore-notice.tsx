"use client";
/** Says where the new-run form's values came from (a restored draft or a prefill). */
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";

export function RestoreNotice({
  restored,
  onStartOver,
}: {
  restored: "draft" | "prefill";
  onStartOver: () => void;
}) {
  return (
    <Alert
      tone="neutral"
      compact
      role="status"
      actions={
        restored === "draft" ? (
          <Button size="sm" variant="ghost" onClick={onStartOver}>
            Start over
          </Button>
        ) : undefined
      }
    >
      {restored === "draft" ? "Your draft was restored." : "Filled in from your selection."}
    </Alert>
  );
}
