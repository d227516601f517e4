// Benchmarks only: with DW_LOOP_DELAY_FILE set, the request thread's event-loop delay (perf_hooks' histogram,
// 1 ms resolution) is appended to that file once a second as {"t", "p50", "p99", "max"} in ms, then reset. The
// upload benchmark reads it to tell a blocked event loop (long tasks here) from requests that only wait for a core.
import { appendFileSync } from 'node:fs'
import { monitorEventLoopDelay } from 'node:perf_hooks'
import { useConfig } from '../utils/config'

export default defineNitroPlugin(nitro => {
  const file = useConfig().diagnostics.loopDelayFile
  if (!file) return
  const histogram = monitorEventLoopDelay({ resolution: 1 })
  histogram.enable()
  const ms = (ns: number) => Math.round(ns / 1e4) / 100
  const timer = setInterval(() => {
    const line = {
      t: Date.now(),
      p50: ms(histogram.percentile(50)),
      p99: ms(histogram.percentile(99)),
      max: ms(histogram.max),
    }
    histogram.reset()
    appendFileSync(file, JSON.stringify(line) + '\n')
  }, 1000)
  timer.unref()
  nitro.hooks.hook('close', () => {
    clearInterval(timer)
    histogram.disable()
  })
})
