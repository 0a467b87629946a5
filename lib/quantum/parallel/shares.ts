/** Part `index` of `parts` of `count` items, as [from, to): contiguous, sizes differing by ≤ 1. */
export function shareOf(count: number, index: number, parts: number): [number, number] {
  return [Math.floor((count * index) / parts), Math.floor((count * (index + 1)) / parts)];
}

/** Part `index` of `parts` of an array (a thread's contiguous slice). */
export function sliceOf(a: Float64Array, index: number, parts: number): Float64Array {
  const len = a.length / parts;
  return a.subarray(index * len, (index + 1) * len);
}
