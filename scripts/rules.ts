// `npm run --silent rules [-- --process=film-mask-soft-litho] < document.json`
// Prints { process, findings } as JSON. Exit 1 when any finding is an error; exit 2 with a message on bad input.
import { fail, readChipDocument } from './lib/cli'
import { BUILT_IN_PROCESSES, checkDesignRules, findProcess } from '~~/geometry/rules'

const args = process.argv.slice(2)
const processId = args.find(a => a.startsWith('--process='))?.slice('--process='.length) ?? BUILT_IN_PROCESSES[0]!.id
const fab = findProcess(processId)
if (!fab) fail([`Unknown process "${processId}": use one of ${BUILT_IN_PROCESSES.map(p => p.id).join(', ')}`])

const document = await readChipDocument()
const findings = checkDesignRules(document, fab)
process.stdout.write(`${JSON.stringify({ process: fab.id, findings }, null, 2)}\n`)
process.exit(findings.some(f => f.severity === 'error') ? 1 : 0)
