/** The fastest of `runs` runs of `fn`, in milliseconds (the least disturbed measurement). */
export function bestOf(fn: () => void, runs = 5): number {
  let min = Infinity;
  for (let i = 0; i < runs; i++) {
    const t = process.hrtime.bigint();
    fn();
    min = Math.min(min, Number(process.hrtime.bigint() - t) / 1e6);
  }
  return min;
}
