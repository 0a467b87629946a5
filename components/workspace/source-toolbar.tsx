"use client";
/**
 * The row above a source editor on the new-run page: a form switch on the left
 * (e.g. OpenQASM 2.0 / 3, Pauli sum / matrix) and, unless read-only, the
 * library picker and file upload on the right. Shared by the circuit and
 * observable cards.
 */
import type { ReactNode } from "react";
import { Button } from "@/components/ui/button";
import { UploadButton, type LoadedFile } from "./file-drop";
import type { FileSlot } from "./file-rules";
import { IconBook } from "@/components/ui/icons";

export function SourceToolbar({
  formatSwitch,
  readOnly,
  slot,
  onLibrary,
  onLoad,
  onReject,
}: {
  formatSwitch: ReactNode;
  readOnly?: boolean;
  slot: FileSlot;
  onLibrary: () => void;
  onLoad: (file: LoadedFile) => void;
  onReject: (message: string) => void;
}) {
  return (
    <div className="flex flex-wrap items-center justify-between gap-2">
      {formatSwitch}
      {readOnly ? null : (
        <div className="flex items-center gap-1">
          <Button variant="ghost" size="sm" icon={<IconBook />} onClick={onLibrary}>
            Library
          </Button>
          <UploadButton slot={slot} onLoad={onLoad} onReject={onReject} />
        </div>
      )}
    </div>
  );
}
