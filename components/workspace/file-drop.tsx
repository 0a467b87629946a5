"use client";
/**
 * Drag-and-drop target and an "Upload" button for one slot of the new-run form. Files are checked
 * (extension, size, text) before their text is handed to `onLoad`; a rejected file gives
 * `onReject(message)` and leaves the editor untouched.
 */
import { useRef, useState, type ReactNode } from "react";
import { Button } from "@/components/ui/button";
import { cn } from "@/components/ui/cn";
import { FILE_RULES, checkFile, checkText, type FileSlot } from "./file-rules";
import { IconUpload } from "@/components/ui/icons";

export type LoadedFile = { name: string; text: string };

async function readChecked(slot: FileSlot, file: File): Promise<LoadedFile | string> {
  const problem = checkFile(slot, file);
  if (problem) return problem;
  const text = await file.text();
  return checkText(file.name, text) ?? { name: file.name, text };
}

export function FileDropZone({
  slot,
  onLoad,
  onReject,
  children,
  className,
}: {
  slot: FileSlot;
  onLoad: (file: LoadedFile) => void;
  onReject: (message: string) => void;
  children: ReactNode;
  className?: string;
}) {
  const [over, setOver] = useState(false);
  const depth = useRef(0);
  return (
    <div
      className={cn("relative", className)}
      onDragEnter={(e) => {
        if (!e.dataTransfer.types.includes("Files")) return;
        e.preventDefault();
        depth.current += 1;
        setOver(true);
      }}
      onDragOver={(e) => {
        if (e.dataTransfer.types.includes("Files")) e.preventDefault();
      }}
      onDragLeave={() => {
        depth.current = Math.max(0, depth.current - 1);
        if (depth.current === 0) setOver(false);
      }}
      onDrop={async (e) => {
        if (!e.dataTransfer.files.length) return;
        e.preventDefault();
        depth.current = 0;
        setOver(false);
        if (e.dataTransfer.files.length > 1) {
          onReject("Drop one file at a time.");
          return;
        }
        const r = await readChecked(slot, e.dataTransfer.files[0]);
        if (typeof r === "string") onReject(r);
        else onLoad(r);
      }}
    >
      {children}
      {over ? (
        <div className="pointer-events-none absolute inset-0 z-10 flex items-center justify-center rounded-md border-2 border-dashed border-accent bg-accent-soft/85 text-sm font-medium text-accent-ink">
          Drop to load {slot === "circuit" ? "the circuit" : "the observable"}
        </div>
      ) : null}
    </div>
  );
}

export function UploadButton({
  slot,
  onLoad,
  onReject,
  label = "Upload",
}: {
  slot: FileSlot;
  onLoad: (file: LoadedFile) => void;
  onReject: (message: string) => void;
  label?: string;
}) {
  const input = useRef<HTMLInputElement>(null);
  return (
    <>
      <input
        ref={input}
        type="file"
        className="sr-only"
        tabIndex={-1}
        aria-hidden
        data-slot={slot}
        accept={FILE_RULES[slot].extensions.join(",")}
        onChange={async (e) => {
          const file = e.target.files?.[0];
          e.target.value = "";
          if (!file) return;
          const r = await readChecked(slot, file);
          if (typeof r === "string") onReject(r);
          else onLoad(r);
        }}
      />
      <Button
        variant="ghost"
        size="sm"
        icon={<IconUpload />}
        onClick={() => input.current?.click()}
      >
        {label}
      </Button>
    </>
  );
}
