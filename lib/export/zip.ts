/**
 * A ZIP archive of text files, built in memory with fflate (ZIP per the PKWARE
 * APPNOTE; DEFLATE per RFC 1951). File names are UTF-8, text is encoded as UTF-8.
 */
import { strToU8, zipSync, type Zippable } from "fflate";

export type TextFile = { name: string; text: string };

export class ZipInputError extends Error {
  constructor(message: string) {
    super(message);
    this.name = "ZipInputError";
  }
}

const SAFE_NAME = /^(?!\/)(?!.*(?:^|\/)\.\.(?:\/|$))[^\\:*?"<>|\u0000-\u001f]+$/;

/** Zips the files (compression level 6). Names must be unique, relative and free of `..`. */
export function zipTextFiles(files: readonly TextFile[], mtime = new Date()): Uint8Array {
  const tree: Zippable = {};
  for (const f of files) {
    if (!SAFE_NAME.test(f.name))
      throw new ZipInputError(`unsafe file name in archive: ${JSON.stringify(f.name)}`);
    if (Object.hasOwn(tree, f.name))
      throw new ZipInputError(`duplicate file name in archive: ${f.name}`);
    tree[f.name] = [strToU8(f.text), { level: 6, mtime }];
  }
  return zipSync(tree);
}
