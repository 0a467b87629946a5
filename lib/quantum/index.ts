/**
 * Public entry point of the Ketwise engine: `estimate`, `previewRequest` and their schemas. Pure TypeScript over typed
 * arrays: no database, queue or network. Everything else in lib/quantum is internal.
 */
export { estimate, type EstimateOptions } from "./estimate/estimate";
export { previewRequest } from "./estimate/preview";
export { DEFAULT_PREVIEW_WORK_BUDGET, type PreviewOptions } from "./estimate/preview-plan";
export * from "./estimate/limits";
export {
  estimateRequestSchema,
  estimateResultSchema,
  previewResultSchema,
  circuitOutlineSchema,
  MAX_OUTLINE_OPS,
  shotPlanSchema,
  convergencePointSchema,
  circuitInputSchema,
  observableInputSchema,
  pauliObservableSchema,
  matrixObservableSchema,
  termsObservableSchema,
  noiseModelSchema,
  type EstimateRequest,
  type EstimateResult,
  type PreviewResult,
  type CircuitOutline,
} from "./schemas";
export { EngineError, isEngineError, type EngineErrorCode, type EngineIssue } from "./errors";

// Circuits: parsing, statistics, outlines for diagrams, OpenQASM 2.0 export of measurement / Hadamard-test circuits.
export {
  parseProgram,
  circuitStats,
  circuitOutline,
  measurementCircuitQasm,
  hadamardTestQasm,
  CIRCUIT_LIMITS,
} from "./circuit";
export type { ParsedProgram, CircuitStats, ProgramInput, QasmFormat } from "./circuit";

// Observables.
export { parsePauliSum, type ParsedPauliSum, type TermOrigin } from "./observable/pauli-parse";
export {
  parsePauliTerms,
  pauliTermsToText,
  type ParsedPauliTerms,
  type PauliTermInput,
} from "./observable/pauli-terms";
export { padPauliSum, sparseLabel, masksToWord } from "./observable/pauli-word";
export { groupQubitWise, type MeasurementSetting } from "./observable/grouping";
export {
  parseMatrixObservable,
  type HermitianMatrix,
  type MatrixObservableInput,
} from "./observable/matrix-observable";
export { lanczosExtremes, type LanczosOptions, type LanczosResult } from "./observable/lanczos";

// Planning (no shots).
export {
  planShots,
  planFromStdDevs,
  allocateShots,
  type ShotPlan,
  type SettingPlan,
} from "./planning/shot-plan";

export type { Circuit, NoiseModel, PauliSum, PauliTerm, ProgressFn } from "./types";
