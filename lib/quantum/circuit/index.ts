/**
 * Circuit front end of the Ketwise engine: OpenQASM 2.0 (in full) and Ketwise's
 * OpenQASM 3 subset → a checked program whose `bind(params)` yields the `Circuit` of
 * types.ts; statistics; OpenQASM 2.0 export of measurement and Hadamard-test circuits.
 * Pure TypeScript, no I/O. Every problem is an EngineError (see circuit-errors.ts).
 */
export { parseProgram, type ParsedProgram, type ProgramInput, type QasmFormat } from "./program";
export { circuitStats, type CircuitStats } from "./stats";
export { circuitOutline } from "./outline";
export { measurementCircuitQasm, measurementCircuitsQasm, hadamardTestQasm } from "./qasm-export";
export { LIMITS as CIRCUIT_LIMITS } from "./program-ir";
