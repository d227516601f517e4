// CSV import of measured sizes with papaparse: one chosen column, one unit, every bad row named; nothing is
// imported while any row is wrong.
import Papa from 'papaparse'
import { MAX_SIZE_UM, MAX_VALUES, SIZE_UNITS, type SizeUnit } from './bench'

export interface CsvRowError {
  row: number
  message: string
}
export type CsvColumnResult =
  | { ok: true; valuesUm: number[]; columns: string[]; preview: string[][]; rows: number }
  | { ok: false; errors: CsvRowError[]; columns: string[]; preview: string[][] }

/** The header (or Column 1…n) and the first rows, for the import form's column choice and preview. */
export function csvPreview(text: string, header = true, rows = 8): { columns: string[]; preview: string[][] } {
  const parsed = Papa.parse<string[]>(text.trim(), { skipEmptyLines: 'greedy', preview: rows + 1 })
  const data = parsed.data
  const width = Math.max(0, ...data.map(r => r.length))
  const columns =
    header && data[0]
      ? data[0].map((c, i) => c.trim() || `Column ${i + 1}`)
      : Array.from({ length: width }, (_, i) => `Column ${i + 1}`)
  return { columns, preview: (header ? data.slice(1) : data).slice(0, rows) }
}

/**
 * The chosen column as sizes in µm. Rows are counted as in the file (the header is row 1). A comma as decimal
 * separator is not guessed: "12,5" is refused with the fix, since it would be ambiguous in a comma-separated file.
 */
export function parseSizeColumn(
  text: string,
  options: { column: string | number; unit: SizeUnit; header?: boolean },
): CsvColumnResult {
  const header = options.header ?? true
  const { columns, preview } = csvPreview(text, header)
  const parsed = Papa.parse<string[]>(text.trim(), { skipEmptyLines: 'greedy' })
  const errors: CsvRowError[] = parsed.errors.slice(0, 20).map(e => ({ row: (e.row ?? 0) + 1, message: e.message }))
  const wanted =
    typeof options.column === 'number'
      ? options.column - 1
      : /^\d+$/.test(options.column) && !columns.includes(options.column)
        ? Number(options.column) - 1
        : columns.indexOf(options.column)
  if (wanted < 0 || wanted >= columns.length) {
    return {
      ok: false,
      errors: [
        {
          row: 1,
          message: `There is no column "${options.column}"; choose one of ${columns.map(c => `"${c}"`).join(', ') || 'none (the file is empty)'}`,
        },
      ],
      columns,
      preview,
    }
  }
  const values: number[] = []
  const first = header ? 1 : 0
  for (let i = first; i < parsed.data.length; i++) {
    const cell = (parsed.data[i]![wanted] ?? '').trim()
    const row = i + 1
    if (cell === '') {
      errors.push({ row, message: `the "${columns[wanted]}" cell is empty` })
      continue
    }
    if (/^-?\d+,\d+$/.test(cell)) {
      errors.push({ row, message: `"${cell}" uses a decimal comma; write it with a point (${cell.replace(',', '.')})` })
      continue
    }
    const value = Number(cell)
    if (!Number.isFinite(value) || !/^[-+]?(\d+\.?\d*|\.\d+)([eE][-+]?\d+)?$/.test(cell)) {
      errors.push({ row, message: `"${cell.slice(0, 40)}" is not a number` })
      continue
    }
    const um = value * SIZE_UNITS[options.unit]
    if (!(um > 0)) {
      errors.push({ row, message: `${cell} must be > 0` })
      continue
    }
    if (um > MAX_SIZE_UM) {
      errors.push({ row, message: `${cell} ${options.unit} is above ${MAX_SIZE_UM / 1000} mm: check the unit` })
      continue
    }
    values.push(um)
    if (errors.length >= 50) break
  }
  if (values.length > MAX_VALUES)
    errors.push({ row: first + MAX_VALUES + 1, message: `a run holds at most ${MAX_VALUES} sizes; split the file` })
  if (!errors.length && !values.length) errors.push({ row: first + 1, message: 'the column holds no sizes' })
  return errors.length
    ? { ok: false, errors: errors.slice(0, 50), columns, preview }
    : { ok: true, valuesUm: values, columns, preview, rows: values.length }
}
