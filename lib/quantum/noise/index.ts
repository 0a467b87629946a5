/** Noise channels (in-place on a density matrix) and noise-model validation. */
export {
  depolarize,
  dampQubit,
  amplitudeDamp,
  phaseDamp,
  measureNonSelective,
  resetQubit,
  noiseAfter1q,
} from "./channels";
export { validateNoiseModel, hasStateNoise, stateNoiseField } from "./validate";
export {
  NoisePlan,
  applyOpNoise,
  type GateNoise,
  type IdleNoise,
  type OpNoise,
} from "./gate-noise";
