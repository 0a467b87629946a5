/**
 * The committed WebAssembly bytes (lib/quantum/wasm/kernels-binary.ts, written by
 * `npm run build:wasm`) are exactly what the AssemblyScript sources compile to, so the two
 * cannot drift apart; and the module compiles here (SIMD and shared memory available).
 */
import { describe, expect, it } from "vitest";
import { KERNELS_WASM_BASE64 } from "@/lib/quantum/wasm/kernels-binary";
import { kernelModule } from "@/lib/quantum/wasm/runtime";
import { compileKernels } from "@/scripts/lib/compile-wasm";

describe("WebAssembly kernel bytes", () => {
  it(
    "match a fresh compile of lib/quantum/wasm/assembly (run npm run build:wasm)",
    { timeout: 120_000 },
    async () => {
      const binary = await compileKernels();
      expect(Buffer.from(binary).toString("base64")).toBe(KERNELS_WASM_BASE64);
    },
  );

  it("compile to a module exporting the kernels", () => {
    const mod = kernelModule();
    expect(mod).not.toBeNull();
    const names = WebAssembly.Module.exports(mod!).map((e) => e.name);
    expect(names).toEqual(
      expect.arrayContaining([
        "general1q",
        "real1q",
        "general2q",
        "pauliDiagonal",
        "pauliTerm",
        "pauliTerms4",
      ]),
    );
  });
});
