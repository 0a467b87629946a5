/**
 * Matrix observables `{ real, imag? }`: a 2^n × 2^n complex
 * matrix H = real + i·imag, checked Hermitian (H_ij = conj(H_ji)) to a relative
 * tolerance of 1e-10 of the largest entry modulus.
 *
 * Qubit order (the one order of the product): the matrix as written is that of
 * A0 ⊗ A1 ⊗ … ⊗ A(n−1) with qubit 0 the LEFTMOST Kronecker factor, so row/column
 * index i = Σ_k b_k·2^(n−1−k) (qubit 0 is the most significant bit; `kron(Z, I)` is
 * Z on qubit 0, like the dense word "ZI"). The statevector's index bit k is qubit k,
 * so the parsed matrix is stored with its indices bit-reversed (`HermitianMatrix` is in
 * state order); error messages keep the indices as written.
 */
import Complex from "complex.js";
import { EngineError } from "../errors";
import { MAX_MATRIX_QUBITS } from "../estimate/limits";
import { plural } from "../../format/plural";

/**
 * Hermitian matrix, row-major d×d, split re/im (symmetrised (H + H†)/2 after the check),
 * in STATE order: index bit k = qubit k (the written matrix with bit-reversed indices).
 */
export interface HermitianMatrix {
  n: number;
  dim: number;
  re: Float64Array;
  im: Float64Array;
}

export interface MatrixObservableInput {
  real: number[][];
  imag?: number[][];
}

export const HERMITIAN_RELATIVE_TOLERANCE = 1e-10;

type Path = (string | number)[];

function invalid(
  message: string,
  path: Path,
  code: "observable_invalid" | "not_hermitian" | "too_large" = "observable_invalid",
): never {
  throw new EngineError(code, message, [{ path, message }]);
}

/** Formats a complex number as "0.5+0.2i" / "0.5−0.1i" (6 significant digits). */
export function formatComplex(z: Complex): string {
  const f = (x: number) => String(Number(x.toPrecision(6)));
  if (z.im === 0) return f(z.re);
  const sign = z.im < 0 ? "\u2212" : "+";
  return `${f(z.re)}${sign}${f(Math.abs(z.im))}i`;
}

function readPart(
  rows: unknown,
  dim: number | null,
  name: "real" | "imag",
): { dim: number; data: Float64Array } {
  const base: Path = ["observable", name];
  if (!Array.isArray(rows) || rows.length === 0)
    invalid(`"${name}" must be a non-empty array of rows`, base);
  const d = dim ?? rows.length;
  if (rows.length !== d) invalid(`"${name}" has ${rows.length} rows but "real" has ${d}`, base);
  if (d < 2 || (d & (d - 1)) !== 0)
    invalid(
      `the matrix is ${d}×${d}; its dimension must be 2^n for n ≥ 1 qubits (2, 4, 8, …)`,
      base,
    );
  if (d > 1 << MAX_MATRIX_QUBITS) {
    invalid(
      `the matrix is ${d}×${d}; matrix observables are limited to ${MAX_MATRIX_QUBITS} qubits (${1 << MAX_MATRIX_QUBITS}×${1 << MAX_MATRIX_QUBITS})`,
      base,
      "too_large",
    );
  }
  const data = new Float64Array(d * d);
  for (let i = 0; i < d; i++) {
    const row = rows[i] as unknown;
    if (!Array.isArray(row) || row.length !== d) {
      invalid(`row ${i} of "${name}" must have ${d} entries (the matrix must be square)`, [
        ...base,
        i,
      ]);
    }
    for (let j = 0; j < d; j++) {
      const v = row[j] as unknown;
      if (typeof v !== "number" || !Number.isFinite(v))
        invalid(`entry (${i},${j}) of "${name}" is not a finite number`, [...base, i, j]);
      data[i * d + j] = v;
    }
  }
  return { dim: d, data };
}

/**
 * Validates and symmetrises a matrix observable. `numQubits`, when given, is the
 * circuit's qubit count and the dimension must be 2^numQubits.
 */
export function parseMatrixObservable(
  input: MatrixObservableInput,
  numQubits?: number,
): HermitianMatrix {
  const real = readPart(input.real, null, "real");
  const dim = real.dim;
  const im =
    input.imag === undefined ? new Float64Array(dim * dim) : readPart(input.imag, dim, "imag").data;
  const re = real.data;
  const n = Math.log2(dim);
  if (numQubits !== undefined && n !== numQubits) {
    invalid(
      `the matrix is ${dim}×${dim} (${plural(n, "qubit")}) but the circuit has ${plural(numQubits, "qubit")}; it must be ${2 ** numQubits}×${2 ** numQubits}`,
      ["observable", "real"],
    );
  }
  let scale = 0;
  for (let k = 0; k < dim * dim; k++) scale = Math.max(scale, Math.hypot(re[k], im[k]));
  let worst = 0;
  let wi = 0;
  let wj = 0;
  for (let i = 0; i < dim; i++) {
    for (let j = i; j < dim; j++) {
      const a = i * dim + j;
      const b = j * dim + i;
      const mismatch = Math.hypot(re[a] - re[b], im[a] + im[b]);
      if (mismatch > worst) [worst, wi, wj] = [mismatch, i, j];
    }
  }
  if (worst > HERMITIAN_RELATIVE_TOLERANCE * scale) {
    const hij = new Complex(re[wi * dim + wj], im[wi * dim + wj]);
    const cji = new Complex(re[wj * dim + wi], im[wj * dim + wi]).conjugate();
    const message =
      `the matrix is not Hermitian: entry (${wi},${wj}) = ${formatComplex(hij)} but conjugate of entry (${wj},${wi}) = ` +
      `${formatComplex(cji)}; mismatch ${Number(hij.sub(cji).abs().toPrecision(6))}`;
    const part = re[wi * dim + wj] === re[wj * dim + wi] ? "imag" : "real";
    invalid(message, ["observable", part, wi, wj], "not_hermitian");
  }
  const outRe = new Float64Array(dim * dim);
  const outIm = new Float64Array(dim * dim);
  const rev = bitReversal(n);
  for (let i = 0; i < dim; i++) {
    const row = rev[i] * dim;
    for (let j = 0; j < dim; j++) {
      outRe[row + rev[j]] = 0.5 * (re[i * dim + j] + re[j * dim + i]);
      outIm[row + rev[j]] = 0.5 * (im[i * dim + j] - im[j * dim + i]);
    }
  }
  return { n, dim, re: outRe, im: outIm };
}

/**
 * rev[i] = i with its n bits reversed: the state-order index of written index i
 * (written bit n−1−k ↔ state bit k). An involution, so it also maps back.
 */
export function bitReversal(n: number): Uint32Array {
  const d = 2 ** n;
  const rev = new Uint32Array(d);
  for (let i = 0; i < d; i++) {
    let r = 0;
    for (let k = 0; k < n; k++) r |= ((i >>> k) & 1) << (n - 1 - k);
    rev[i] = r >>> 0;
  }
  return rev;
}

/**
 * The written form of a state-order matrix (inverse of the parse permutation):
 * `{ real, imag }` rows in the product's order, qubit 0 the leftmost factor.
 */
export function writtenMatrix(h: HermitianMatrix): { real: number[][]; imag: number[][] } {
  const rev = bitReversal(h.n);
  const real: number[][] = [];
  const imag: number[][] = [];
  for (let i = 0; i < h.dim; i++) {
    real.push(Array.from({ length: h.dim }, (_, j) => h.re[rev[i] * h.dim + rev[j]]));
    imag.push(Array.from({ length: h.dim }, (_, j) => h.im[rev[i] * h.dim + rev[j]]));
  }
  return { real, imag };
}
