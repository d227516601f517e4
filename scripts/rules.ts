// `npm run --silent rules [-- --process=film-mask-soft-litho] < document.json`
// Prints { process, findings } as JSON. Exit 1 when any finding is an error; exit 2 with a message on bad input.
import { parseChipDocument } from '#shared/schemas/chip'
import { BUILT_IN_PROCESSES, checkDesignRules, findProcess } from '~~/geometry/rules'

async function readStdin(): Promise<string> {
  const chunks: Buffer[] = []
  for await (const c of process.stdin) chunks.push(c as Buffer)
  return Buffer.concat(chunks).toString('utf8')
}

function fail(lines: string[]): never {
  for (const l of lines) process.stderr.write(`${l}\n`)
  process.exit(2)
}

const args = process.argv.slice(2)
const processId = args.find((a) => a.startsWith('--process='))?.slice('--process='.length) ?? BUILT_IN_PROCESSES[0]!.id
const fab = findProcess(processId)
if (!fab) fail([`Unknown process "${processId}": use one of ${BUILT_IN_PROCESSES.map((p) => p.id).join(', ')}`])

let json: unknown
try {
  json = JSON.parse(await readStdin())
} catch (e) {
  fail([`Input is not JSON (${(e as Error).message}): pipe a chip document on stdin`])
}
const parsed = parseChipDocument(json)
if (!parsed.ok) fail(parsed.errors.map((e) => e.message))
const findings = checkDesignRules(parsed.document, fab)
process.stdout.write(`${JSON.stringify({ process: fab.id, findings }, null, 2)}\n`)
process.exit(findings.some((f) => f.severity === 'error') ? 1 : 0)
