/**
 * Which dropped or chosen files the new-run form accepts, checked before reading them:
 * the extension must fit the slot, the size must be within its limit, and the content
 * must be UTF-8 text (no NUL bytes). Messages name the file and the limit.
 */
import { formatBytes } from "@/lib/format";
export type FileSlot = "circuit" | "observable";

export const FILE_RULES: Record<
  FileSlot,
  { extensions: string[]; maxBytes: number; what: string }
> = {
  circuit: {
    extensions: [".qasm", ".qasm3", ".qasm2", ".txt"],
    maxBytes: 1_000_000,
    what: "an OpenQASM file (.qasm)",
  },
  observable: {
    extensions: [".txt", ".pauli", ".json"],
    maxBytes: 4_000_000,
    what: "a Pauli-sum text file (.txt, .pauli) or a JSON matrix (.json)",
  },
};

export function extensionOf(name: string): string {
  const m = /\.[^./\\]+$/.exec(name.toLowerCase());
  return m ? m[0] : "";
}

/** null when acceptable, else a message for the user. */
export function checkFile(slot: FileSlot, file: { name: string; size: number }): string | null {
  const rule = FILE_RULES[slot];
  const ext = extensionOf(file.name);
  if (!rule.extensions.includes(ext)) {
    return `“${file.name}” is not ${rule.what}. Accepted: ${rule.extensions.join(", ")}.`;
  }
  if (file.size > rule.maxBytes) {
    return `“${file.name}” is ${formatBytes(file.size)}; the limit here is ${formatBytes(rule.maxBytes)}.`;
  }
  if (file.size === 0) return `“${file.name}” is empty.`;
  return null;
}

/** null when the text looks like text, else a message. */
export function checkText(name: string, text: string): string | null {
  if (text.includes("\u0000")) return `“${name}” looks like a binary file, not text.`;
  return null;
}
