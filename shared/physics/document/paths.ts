// Request paths for issues found in a chip document: "document.channels[3].width", as a designer reads them.

/** `channels.3.width` (the chip schema's dotted path) → `document.channels[3].width`. */
export function documentPath(dotted: string | (string | number)[]): string {
  const parts = typeof dotted === 'string' ? (dotted === '' ? [] : dotted.split('.')) : dotted.map(String)
  let path = 'document'
  for (const part of parts) path += /^\d+$/.test(part) ? `[${part}]` : `.${part}`
  return path
}
