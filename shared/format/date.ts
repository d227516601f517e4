// One way to write a date, per context, in the viewer's own locale and time zone (Intl.DateTimeFormat, ECMA-402).
//  - `moment`: when something happened (a save, a comment, a release): "2 Dec 2026, 17:45" in en-GB;
//  - `day`: a calendar day (a calibration, a bench run's date): "2 Dec 2026".
// Pure: the caller passes the locale and time zone (composables/useWhen.ts picks the viewer's).

export type DateContext = 'moment' | 'day'

const OPTIONS: Record<DateContext, Intl.DateTimeFormatOptions> = {
  moment: { dateStyle: 'medium', timeStyle: 'short' },
  day: { dateStyle: 'medium' },
}

export interface DateSettings {
  locale?: string
  timeZone?: string
}

const cache = new Map<string, Intl.DateTimeFormat>()

function formatter(context: DateContext, { locale, timeZone }: DateSettings): Intl.DateTimeFormat {
  const key = `${context}|${locale ?? ''}|${timeZone ?? ''}`
  let f = cache.get(key)
  if (!f) {
    try {
      f = new Intl.DateTimeFormat(locale, { ...OPTIONS[context], timeZone })
    } catch {
      // An unknown locale tag or zone name (from a header) falls back to the runtime's default.
      f = new Intl.DateTimeFormat(undefined, { ...OPTIONS[context], timeZone: 'UTC' })
    }
    cache.set(key, f)
  }
  return f
}

/** `iso` (or a Date) written for `context`; "—" for a missing or unreadable date. */
export function formatDate(
  iso: string | Date | null | undefined,
  context: DateContext,
  settings: DateSettings = {},
): string {
  if (iso == null) return '—'
  const d = iso instanceof Date ? iso : new Date(iso)
  if (Number.isNaN(d.getTime())) return '—'
  const text = formatter(context, settings).format(d)
  return settings.timeZone === 'UTC' && context === 'moment' ? `${text} UTC` : text
}

/** The first language of an Accept-Language header ("de-CH,de;q=0.9" → "de-CH"), if it is a valid tag. */
export function localeFromHeader(header: string | null | undefined): string | undefined {
  const first = header?.split(',')[0]?.split(';')[0]?.trim()
  if (!first || first === '*') return undefined
  try {
    return Intl.getCanonicalLocales(first)[0]
  } catch {
    return undefined
  }
}
