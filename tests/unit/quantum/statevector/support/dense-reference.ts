/**
 * Independent dense reference built with mathjs (complex matrices, kron, multiply).
 *
 * Tensor order: the reference uses the TEXTBOOK order — qubit 0 is the leftmost Kronecker
 * factor, so basis index T = Σ_q b_q · 2^(n−1−q). The engine stores amplitude index I with
 * bit q = qubit q, I = Σ_q b_q · 2^q. Hence T = reverseBits(I, n): the engine's amplitude I
 * is compared with the reference's entry reverseBits(I, n).
 *
 * A gate U on operands (q_0, …, q_{k−1}) (first operand = most significant, types.ts) is
 * embedded as the textbook operator U ⊗ I written in the factor order
 * L = (q_0, …, q_{k−1}, remaining qubits ascending), then relabelled to the natural factor
 * order 0, 1, …, n−1 (a permutation of basis labels: entry (T1, T2) = K(L(T1), L(T2))).
 */
import { create, all, type Complex, type Matrix } from "mathjs";

export const math = create(all);

export function reverseBits(i: number, n: number): number {
  let r = 0;
  for (let q = 0; q < n; q++) r |= ((i >> q) & 1) << (n - 1 - q);
  return r;
}

/** An interleaved re/im Float64Array d×d as a mathjs complex matrix. */
export function toMath(m: Float64Array, d: number): Matrix {
  return math.matrix(
    Array.from({ length: d }, (_, r) =>
      Array.from({ length: d }, (_, c) => math.complex(m[2 * (r * d + c)], m[2 * (r * d + c) + 1])),
    ),
  );
}

/** The 2^n × 2^n textbook-order operator of `u` acting on `qubits` (see module comment). */
export function fullOperator(u: Float64Array, qubits: readonly number[], n: number): Matrix {
  const k = qubits.length;
  const K = math.kron(toMath(u, 1 << k), math.identity(1 << (n - k)) as Matrix) as Matrix;
  const order = [...qubits];
  for (let q = 0; q < n; q++) if (!order.includes(q)) order.push(q);
  const D = 1 << n;
  const label = new Array<number>(D);
  for (let T = 0; T < D; T++) {
    let L = 0;
    for (let t = 0; t < n; t++) L |= ((T >> (n - 1 - order[t])) & 1) << (n - 1 - t);
    label[T] = L;
  }
  const src = K.toArray() as unknown as Complex[][];
  return math.matrix(
    Array.from({ length: D }, (_, r) =>
      Array.from({ length: D }, (_, c) => math.complex(src[label[r]][label[c]])),
    ),
  );
}

/** |0…0⟩ as a 2^n × 1 column. */
export function zeroColumn(n: number): Matrix {
  return math.matrix(Array.from({ length: 1 << n }, (_, i) => [math.complex(i === 0 ? 1 : 0, 0)]));
}

/** |0…0⟩⟨0…0|. */
export function zeroDensity(n: number): Matrix {
  const D = 1 << n;
  return math.matrix(
    Array.from({ length: D }, (_, r) =>
      Array.from({ length: D }, (_, c) => math.complex(r === 0 && c === 0 ? 1 : 0, 0)),
    ),
  );
}

export function dagger(a: Matrix): Matrix {
  return math.ctranspose(a) as Matrix;
}

/** Σ_j K_j ρ K_j† for full-space Kraus operators. */
export function applyKraus(rho: Matrix, kraus: readonly Matrix[]): Matrix {
  let out = math.multiply(math.multiply(kraus[0], rho), dagger(kraus[0])) as Matrix;
  for (let j = 1; j < kraus.length; j++) {
    out = math.add(out, math.multiply(math.multiply(kraus[j], rho), dagger(kraus[j]))) as Matrix;
  }
  return out;
}

/** Entry (r, c) of a mathjs matrix as [re, im]. */
export function entry(a: Matrix, r: number, c: number): [number, number] {
  const v = a.get([r, c]) as Complex | number;
  return typeof v === "number" ? [v, 0] : [v.re, v.im];
}

/** Largest |engine − reference| over a statevector (engine index I ↔ reference row reverseBits(I)). */
export function stateDistance(re: Float64Array, im: Float64Array, ref: Matrix, n: number): number {
  let worst = 0;
  for (let I = 0; I < re.length; I++) {
    const [rr, ri] = entry(ref, reverseBits(I, n), 0);
    worst = Math.max(worst, Math.hypot(re[I] - rr, im[I] - ri));
  }
  return worst;
}

/** Largest |engine − reference| over a density matrix (both indices bit-reversed). */
export function densityDistance(
  re: Float64Array,
  im: Float64Array,
  ref: Matrix,
  n: number,
): number {
  const d = 1 << n;
  let worst = 0;
  for (let r = 0; r < d; r++)
    for (let c = 0; c < d; c++) {
      const [xr, xi] = entry(ref, reverseBits(r, n), reverseBits(c, n));
      worst = Math.max(worst, Math.hypot(re[r * d + c] - xr, im[r * d + c] - xi));
    }
  return worst;
}
