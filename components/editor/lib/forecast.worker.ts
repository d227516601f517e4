// The editor's forecast worker: the live forecast and rule checks (forecastApi.ts), called from the page through
// comlink (liveForecast.ts).
import { expose } from 'comlink'
import { createForecastApi } from './forecastApi'

expose(createForecastApi())
