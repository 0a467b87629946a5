// AssemblyScript (compiled by `npm run build:wasm`): gathers and scatters of a cache tile
// (statevector/tiling.ts). `runAt` points at `runs` byte offsets (u32); run r of `runBytes`
// bytes is copied between state + runAt[r] and tile + r·runBytes, for re and im alike.

export function gatherTile(
  re: usize,
  im: usize,
  tileRe: usize,
  tileIm: usize,
  runAt: usize,
  runs: i32,
  runBytes: usize,
): void {
  for (let r = 0; r < runs; r++) {
    const at = <usize>load<u32>(runAt + (<usize>r << 2));
    const o = <usize>r * runBytes;
    memory.copy(tileRe + o, re + at, runBytes);
    memory.copy(tileIm + o, im + at, runBytes);
  }
}

export function scatterTile(
  re: usize,
  im: usize,
  tileRe: usize,
  tileIm: usize,
  runAt: usize,
  runs: i32,
  runBytes: usize,
): void {
  for (let r = 0; r < runs; r++) {
    const at = <usize>load<u32>(runAt + (<usize>r << 2));
    const o = <usize>r * runBytes;
    memory.copy(re + at, tileRe + o, runBytes);
    memory.copy(im + at, tileIm + o, runBytes);
  }
}
