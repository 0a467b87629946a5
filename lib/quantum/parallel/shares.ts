/** Part `index` of `parts` of `count` items, as [from, to): contiguous, sizes differing by ≤ 1. */
export function shareOf(count: number, index: number, parts: number): [number, number] {
  return [Math.floor((count * index) / parts), Math.floor((count * (index + 1)) / parts)];
}
