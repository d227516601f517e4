// The one way the core benchmarks time a piece of work: one warm-up run, then `repeats` runs; median and worst (ms).
export function timed(run: () => void, repeats: number): { median: number; worst: number } {
  run() // warm-up: JIT and caches, not counted
  const times: number[] = []
  for (let i = 0; i < repeats; i++) {
    const start = performance.now()
    run()
    times.push(performance.now() - start)
  }
  times.sort((a, b) => a - b)
  return { median: times[Math.floor(times.length / 2)]!, worst: times.at(-1)! }
}

/** Median of `repeats` timed runs after a warm-up (ms). */
export const median = (run: () => void, repeats: number): number => timed(run, repeats).median
