// The one way the benchmarks time a piece of work.

/** One warm-up run (JIT and caches, not counted), then `repeats` runs: median and worst (ms), and the last result. */
export function timed<T>(run: () => T, repeats: number): { median: number; worst: number; value: T } {
  let value = run()
  const times: number[] = []
  for (let i = 0; i < repeats; i++) {
    const start = performance.now()
    value = run()
    times.push(performance.now() - start)
  }
  times.sort((a, b) => a - b)
  return { median: times[Math.floor(times.length / 2)]!, worst: times.at(-1)!, value }
}

/** Median of `repeats` timed runs after a warm-up (ms). */
export const median = (run: () => void, repeats: number): number => timed(run, repeats).median

/** Best of `runs` runs of asynchronous work (ms): no warm-up, the fastest run stands for the work itself. */
export async function bestOf(runs: number, work: () => unknown): Promise<number> {
  let best = Infinity
  for (let i = 0; i < runs; i++) {
    const start = performance.now()
    await work()
    best = Math.min(best, performance.now() - start)
  }
  return best
}
