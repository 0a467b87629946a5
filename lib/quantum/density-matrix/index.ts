/** Density-matrix method: storage (row-major, index bit k = qubit k), ρ → UρU†, noisy simulation. */
export { createZeroDensity, diagonal, trace, densityFromState } from "./state";
export { applyUnitaryDM, conjugateMatrix } from "./kernels";
export { simulateDensityMatrix, type DensityOptions } from "./simulate";
export { applyNoisyGate, type GateNoise } from "./noisy-gate";
