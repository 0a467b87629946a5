// AssemblyScript entry of the engine's WebAssembly kernels (`npm run build:wasm`).
export { general1q, real1q } from "./kernels-1q";
export { general2q } from "./kernels-2q";
export { twoBlock } from "./kernels-two-block";
export { pauliDiagonal, pauliTerm, pauliTerms4 } from "./pauli-mask";
export { pauliPair } from "./pauli-pair";
export { copyTile } from "./tile-copy";
export { cross1q, cross2q } from "./cross";
export { twoBlockStep } from "./two-block-step";
export { lambdaTerm } from "./lambda-term";
export { noisy1q } from "./noisy-1q";
