"use client";

import { StatusPage } from "@/components/shell/status-page";
import { themeInitScript } from "@/components/shell/theme";
import { Button } from "@/components/ui/button";
import { fontVariables } from "./fonts/fonts";
import "./globals.css";

/**
 * Replaces the root layout when the layout itself fails, so it renders its own
 * <html>/<body>, styles, fonts and theme choice.
 */
export default function GlobalError({ error, retry }: { error: unknown; retry: () => void }) {
  const digest =
    error instanceof Error && "digest" in error && typeof error.digest === "string"
      ? error.digest
      : undefined;
  return (
    <html lang="en" className={fontVariables} suppressHydrationWarning>
      <head>
        <title>Error · Ketwise</title>
        <script dangerouslySetInnerHTML={{ __html: themeInitScript }} />
      </head>
      <body>
        <StatusPage
          code="error"
          title="Ketwise could not load this page"
          actions={<Button onClick={() => retry()}>Try again</Button>}
          detail={
            digest ? (
              <>
                Error reference <code className="figures text-ink-2">{digest}</code>
              </>
            ) : null
          }
        >
          Something failed before the page could be drawn. Trying again is safe.
        </StatusPage>
      </body>
    </html>
  );
}
