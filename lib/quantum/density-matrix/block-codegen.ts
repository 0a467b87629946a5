/**
 * Straight-line block kernels for the one-pass noisy gate (noisy-gate.ts), generated per
 * block map and cached. A generic loop over a sparse map costs an indirection per weight;
 * writing the map out as expressions with its weights as literals lets the JIT keep the
 * whole block in registers. Only numbers from the map enter the generated source (no user
 * text), and at most a few distinct maps occur per run (they depend on the gate's structure
 * and the noise rates, not on angles), so compiling is rare.
 *
 * Generated function (re, im, mask, count, idx, ur, ui): for every block base b (bits of
 * `mask` clear), the entries b | idx[e] (e = r·d + c) are loaded, optionally conjugated by a
 * dense U (B ← U B U†, U given as split re/im d×d arrays), then out_e = Σ w_{e,f} x_f.
 */
export interface SparseMap {
  /** Row pointers (length entries + 1) into src/wr/wi. */
  ptr: Int32Array;
  src: Int32Array;
  wr: Float64Array;
  wi: Float64Array;
}

export type BlockKernel = (
  re: Float64Array,
  im: Float64Array,
  mask: number,
  count: number,
  idx: Int32Array,
  ur: Float64Array | null,
  ui: Float64Array | null,
) => void;

const cache = new Map<string, BlockKernel>();
const MAX_CACHED = 256;

const lit = (v: number): string => (Object.is(v, -0) ? "0" : String(v));

function sumExpr(terms: string[]): string {
  return terms.length === 0 ? "0" : terms.join(" + ").replace(/\+ -/g, "- ");
}

function source(d: number, map: SparseMap, dense: boolean): string {
  const entries = d * d;
  const lines: string[] = [];
  for (let e = 0; e < entries; e++) lines.push(`const o${e} = idx[${e}];`);
  if (dense)
    for (let e = 0; e < entries; e++) lines.push(`const u${e}r = ur[${e}], u${e}i = ui[${e}];`);
  lines.push("const notMask = ~mask;");
  lines.push("for (let t = 0, b = 0; t < count; t++, b = ((b | mask) + 1) & notMask) {");
  for (let e = 0; e < entries; e++)
    lines.push(`const j${e} = b | o${e}; const x${e}r = re[j${e}], x${e}i = im[j${e}];`);
  let v = "x";
  if (dense) {
    // T = U X: T_{rc} = Σ_j U_{rj} X_{jc}
    for (let r = 0; r < d; r++)
      for (let c = 0; c < d; c++) {
        const re: string[] = [];
        const im: string[] = [];
        for (let j = 0; j < d; j++) {
          const u = r * d + j,
            x = j * d + c;
          re.push(`u${u}r * x${x}r`, `-u${u}i * x${x}i`);
          im.push(`u${u}r * x${x}i`, `u${u}i * x${x}r`);
        }
        lines.push(`const t${r * d + c}r = ${sumExpr(re)}, t${r * d + c}i = ${sumExpr(im)};`);
      }
    // Y = T U†: Y_{rc} = Σ_j T_{rj} conj(U_{cj})
    for (let r = 0; r < d; r++)
      for (let c = 0; c < d; c++) {
        const re: string[] = [];
        const im: string[] = [];
        for (let j = 0; j < d; j++) {
          const tt = r * d + j,
            u = c * d + j;
          re.push(`t${tt}r * u${u}r`, `t${tt}i * u${u}i`);
          im.push(`t${tt}i * u${u}r`, `-t${tt}r * u${u}i`);
        }
        lines.push(`const y${r * d + c}r = ${sumExpr(re)}, y${r * d + c}i = ${sumExpr(im)};`);
      }
    v = "y";
  }
  for (let e = 0; e < entries; e++) {
    const re: string[] = [];
    const im: string[] = [];
    for (let j = map.ptr[e]; j < map.ptr[e + 1]; j++) {
      const f = map.src[j],
        wr = map.wr[j],
        wi = map.wi[j];
      if (wr !== 0) {
        re.push(`${lit(wr)} * ${v}${f}r`);
        im.push(`${lit(wr)} * ${v}${f}i`);
      }
      if (wi !== 0) {
        re.push(`${lit(-wi)} * ${v}${f}i`);
        im.push(`${lit(wi)} * ${v}${f}r`);
      }
    }
    lines.push(`re[j${e}] = ${sumExpr(re)}; im[j${e}] = ${sumExpr(im)};`);
  }
  lines.push("}");
  return lines.join("\n");
}

/** The compiled kernel for a block map (d = 2 or 4), from the cache when seen before. */
export function blockKernel(d: number, map: SparseMap, dense: boolean): BlockKernel {
  const key = `${d}|${dense ? 1 : 0}|${Array.from(map.ptr).join(",")}|${Array.from(map.src).join(",")}|${Array.from(map.wr).join(",")}|${Array.from(map.wi).join(",")}`;
  let fn = cache.get(key);
  if (!fn) {
    // generated from numbers only (see the module comment)
    fn = new Function(
      "re",
      "im",
      "mask",
      "count",
      "idx",
      "ur",
      "ui",
      source(d, map, dense),
    ) as BlockKernel;
    if (cache.size >= MAX_CACHED) cache.clear();
    cache.set(key, fn);
  }
  return fn;
}
