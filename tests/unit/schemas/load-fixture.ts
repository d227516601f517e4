import { readFileSync } from 'node:fs'
import { fileURLToPath } from 'node:url'

/** Reads a JSON fixture from tests/fixtures/documents as plain data (a fresh copy each call). */
export function loadDocumentFixture(name: string): Record<string, any> {
  const url = new URL(`../../fixtures/documents/${name}`, import.meta.url)
  return JSON.parse(readFileSync(fileURLToPath(url), 'utf8'))
}
