// Reads a DXF we wrote with Debian's python3-ezdxf (an independent DXF implementation): `recover.readfile`, then
// the caller's lines of Python with `doc`, `auditor` (a fresh audit) and `msp` defined; their last line prints JSON.
import { execFileSync, spawnSync } from 'node:child_process'
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'

const PYTHON = '/usr/bin/python3'

export function ezdxfReport<T = Record<string, unknown>>(dxf: string, lines: string[]): T {
  if (spawnSync(PYTHON, ['-c', 'import ezdxf']).status !== 0) {
    throw new Error(
      'ezdxf is missing: run `apt-get update && apt-get install -y python3-ezdxf` (Debian /usr/bin/python3)',
    )
  }
  const dir = mkdtempSync(join(tmpdir(), 'dw-ezdxf-'))
  try {
    const file = join(dir, 'chip.dxf')
    writeFileSync(file, dxf)
    const script = [
      'import sys, json',
      'from ezdxf import recover',
      'doc, auditor = recover.readfile(sys.argv[1])',
      'auditor = doc.audit()',
      'msp = doc.modelspace()',
      ...lines,
    ].join('\n')
    return JSON.parse(execFileSync(PYTHON, ['-c', script, file], { encoding: 'utf8' })) as T
  } finally {
    rmSync(dir, { recursive: true, force: true })
  }
}
