/** `npm run build:wasm`: compiles the engine's WebAssembly kernels into a committed TS module. */
import { writeFileSync } from "node:fs";
import { format, resolveConfig } from "prettier";
import { WASM_MODULE_FILE, compileKernels, kernelModuleSource } from "./lib/compile-wasm";

const binary = await compileKernels();
const options = (await resolveConfig(WASM_MODULE_FILE)) ?? {};
const source = await format(kernelModuleSource(binary), { ...options, filepath: WASM_MODULE_FILE });
writeFileSync(WASM_MODULE_FILE, source);
console.log(`${WASM_MODULE_FILE}: ${binary.length} bytes of WebAssembly`);
