// AssemblyScript (compiled by `npm run build:wasm`): the gathers and scatters of a cache tile
// (statevector/tiling.ts). `runAt` points at `runs` byte offsets (u32); run r of `runBytes`
// bytes moves between state + runAt[r] and tile + r·runBytes, for re and im alike: into the
// tile when `gather` is 1, back into the state when it is 0.

export function copyTile(
  re: usize,
  im: usize,
  tileRe: usize,
  tileIm: usize,
  runAt: usize,
  runs: i32,
  runBytes: usize,
  gather: i32,
): void {
  for (let r = 0; r < runs; r++) {
    const at = <usize>load<u32>(runAt + (<usize>r << 2));
    const o = <usize>r * runBytes;
    if (gather) {
      memory.copy(tileRe + o, re + at, runBytes);
      memory.copy(tileIm + o, im + at, runBytes);
    } else {
      memory.copy(re + at, tileRe + o, runBytes);
      memory.copy(im + at, tileIm + o, runBytes);
    }
  }
}
