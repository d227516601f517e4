// Dates in the viewer's locale and time zone, one style per context (shared/format/date.ts).
// The server renders with the Accept-Language locale in UTC (saying "UTC"); once the page is mounted in the browser
// the same dates switch to the browser's own zone, so the server and the hydrating client agree on the first paint.
import { formatDate, localeFromHeader, type DateContext } from '#shared/format/date'

export function useWhen() {
  const headerLocale = useState<string | undefined>('dw-locale', () =>
    import.meta.server ? localeFromHeader(useRequestHeaders(['accept-language'])['accept-language']) : undefined,
  )
  const zone = ref<string>('UTC')
  const locale = ref<string | undefined>(headerLocale.value)
  onMounted(() => {
    locale.value = navigator.language || headerLocale.value
    zone.value = Intl.DateTimeFormat().resolvedOptions().timeZone || 'UTC'
  })
  return (iso: string | Date | null | undefined, context: DateContext = 'moment') =>
    formatDate(iso, context, { locale: locale.value, timeZone: zone.value })
}
