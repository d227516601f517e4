// Shared by the command-line runners that read a chip document on stdin.
import { parseChipDocument, type ChipDocument } from '#shared/schemas/chip'

/** Writes each line to stderr and exits 2: the runners' answer to bad input. */
export function fail(lines: string[]): never {
  for (const l of lines) process.stderr.write(`${l}\n`)
  process.exit(2)
}

export async function readStdin(): Promise<string> {
  const chunks: Buffer[] = []
  for await (const c of process.stdin) chunks.push(c as Buffer)
  return Buffer.concat(chunks).toString('utf8')
}

/** The chip document on stdin, upgraded and validated, or exit 2 with every message naming its element. */
export async function readChipDocument(): Promise<ChipDocument> {
  let json: unknown
  try {
    json = JSON.parse(await readStdin())
  } catch (e) {
    fail([`Input is not JSON (${(e as Error).message}): pipe a chip document on stdin`])
  }
  const parsed = parseChipDocument(json)
  if (!parsed.ok) fail(parsed.errors.map(e => e.message))
  return parsed.document
}
