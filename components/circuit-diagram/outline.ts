/**
 * What the new-run page needs to draw a circuit and offer its parameters: the qubit labels,
 * the OpenQASM 3 inputs and the top-level operations (measure/reset/barrier/gates with
 * numeric parameters). Computed on the server's preview threads and answered by the
 * preview endpoint (the parser stays out of the browser); the shape is the engine's
 * `circuitOutlineSchema`.
 */
export type { CircuitOutline } from "@/lib/quantum/schemas";
