// `npm run bench`: every benchmark of the pure core, printed as figures and ratios. Not a test.
const suites = [
  './bench/physics.ts',
  './bench/geometry.ts',
  './bench/klayout.ts',
  './bench/planner.ts',
  './bench/imaging.ts',
]
for (const suite of suites) {
  try {
    const mod = await import(suite)
    await mod.run()
  } catch (error) {
    if ((error as NodeJS.ErrnoException).code === 'ERR_MODULE_NOT_FOUND' && String(error).includes(suite.slice(2)))
      continue
    throw error
  }
}
