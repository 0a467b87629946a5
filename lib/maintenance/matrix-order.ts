/**
 * Stored matrix observables written before the qubit order was fixed kept their matrix
 * in the engine's state order (row/column index bit k = qubit k). Since then a matrix is
 * read with qubit 0 as the leftmost Kronecker factor (index i = Σ_k b_k·2^(n−1−k)). To keep
 * the physical meaning of what was saved, a stored matrix M becomes M' with
 * M'[i][j] = M[rev(i)][rev(j)] (rev = n-bit reversal), and eigenbasis histograms of stored
 * results, keyed by outcome index with the least significant digit first, are re-keyed
 * most significant digit first. Pure functions; the data migration applies them once.
 */

export type StoredMatrix = { real: number[][]; imag?: number[][] };

function reversal(dim: number): number[] {
  const n = Math.round(Math.log2(dim));
  return Array.from({ length: dim }, (_, i) => {
    let r = 0;
    for (let k = 0; k < n; k++) r |= ((i >>> k) & 1) << (n - 1 - k);
    return r;
  });
}

function permute(rows: number[][], rev: number[]): number[][] {
  return rows.map((_, i) => rows[rev[i]].map((__, j) => rows[rev[i]][rev[j]]));
}

/** The same operator in the written (qubit 0 leftmost) order; a malformed matrix is returned unchanged. */
export function legacyMatrixToWritten<T extends StoredMatrix>(m: T): T {
  const d = Array.isArray(m.real) ? m.real.length : 0;
  const square = (rows: unknown) =>
    Array.isArray(rows) &&
    rows.length === d &&
    rows.every((r) => Array.isArray(r) && r.length === d);
  if (d < 2 || (d & (d - 1)) !== 0 || !square(m.real) || (m.imag !== undefined && !square(m.imag)))
    return m;
  const rev = reversal(d);
  return {
    ...m,
    real: permute(m.real, rev),
    ...(m.imag !== undefined ? { imag: permute(m.imag, rev) } : {}),
  };
}

type Json = Record<string, unknown>;

/** A stored run request with a matrix observable, in the written order (others unchanged). */
export function migrateRunRequest(request: Json): Json {
  const obs = request.observable as Json | undefined;
  if (!obs || obs.format !== "matrix") return request;
  return { ...request, observable: legacyMatrixToWritten(obs as unknown as StoredMatrix) };
}

/** A stored result: eigenbasis count keys re-read most significant digit first (others unchanged). */
export function migrateRunResult(result: Json | null): Json | null {
  if (!result || !Array.isArray(result.groups)) return result;
  const groups = (result.groups as Json[]).map((g) => {
    if (g.bases !== "eigenbasis" || !g.counts || typeof g.counts !== "object") return g;
    const counts: Record<string, unknown> = {};
    for (const [key, c] of Object.entries(g.counts as Record<string, unknown>))
      counts[key.split("").reverse().join("")] = c;
    return { ...g, counts };
  });
  return { ...result, groups };
}
