// The demo lab's own library: one oil and one surfactant pair, both "measured in our lab" (invented values).
import { and, eq } from 'drizzle-orm'
import { MEASURED_IN_OUR_LAB, pairKey } from '../../shared/schemas/libraries'
import { labLibraryEntries } from './schema'
import type { Db } from '../utils/db'

export const DEMO_OIL = {
  key: 'lab-light-oil-lot-3',
  name: 'Light hydrocarbon oil, lot 3',
  table: [
    { temperatureC: 15, viscosityMPaS: 4.1, densityKgPerM3: 812, surfaceTensionMNPerM: 27.6 },
    { temperatureC: 25, viscosityMPaS: 3.3, densityKgPerM3: 805, surfaceTensionMNPerM: 26.8 },
    { temperatureC: 37, viscosityMPaS: 2.6, densityKgPerM3: 797, surfaceTensionMNPerM: 25.9 },
  ],
}
export const DEMO_PAIR = {
  liquids: ['water', DEMO_OIL.key] as [string, string],
  surfactant: 'sorbitan-monooleate',
  interfacialTensionMNPerM: 3.6,
}

export async function seedDemoLibrary(db: Db, labId: string, adminId: string) {
  const rows = [
    { kind: 'liquid', key: DEMO_OIL.key, name: DEMO_OIL.name, data: { table: DEMO_OIL.table } },
    {
      kind: 'pair',
      key: pairKey(DEMO_PAIR.liquids, DEMO_PAIR.surfactant),
      name: `Water in ${DEMO_OIL.name}, sorbitan monooleate`,
      data: DEMO_PAIR,
    },
  ]
  for (const row of rows) {
    const [existing] = await db
      .select({ id: labLibraryEntries.id })
      .from(labLibraryEntries)
      .where(
        and(
          eq(labLibraryEntries.labId, labId),
          eq(labLibraryEntries.kind, row.kind),
          eq(labLibraryEntries.key, row.key),
        ),
      )
    if (existing) continue
    await db
      .insert(labLibraryEntries)
      .values({ labId, ...row, source: MEASURED_IN_OUR_LAB, createdBy: adminId, updatedBy: adminId })
  }
}
