/** Statevector method: storage, gate application, fusion, simulation and memory guards. */
export { createZeroState, probabilities, normSquared, cloneState } from "./state";
export { applyMatrix, checkGateShape } from "./kernels";
export { applyToAmplitudes } from "./dispatch";
export { fuseGates, GateFuser } from "./fusion";
export {
  simulateStatevector,
  assertNoMidCircuitMeasurement,
  circuitGates,
  type StatevectorOptions,
} from "./simulate";
export {
  statevectorBytes,
  densityMatrixBytes,
  formatBytes,
  assertStatevectorFits,
  assertDensityMatrixFits,
  MAX_STATEVECTOR_QUBITS,
  MAX_DENSITY_QUBITS,
  type MemoryLimits,
} from "./memory";
export { RunControl, throwIfCanceled, type RunOptions } from "./run-control";
