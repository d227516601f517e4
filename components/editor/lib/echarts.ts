// ECharts with only the parts the editor's plots use (tree-shaken), drawn as SVG so the plots stay crisp and light.
import { init, use } from 'echarts/core'
import { LineChart, ScatterChart } from 'echarts/charts'
import { GridComponent, LegendComponent, TooltipComponent } from 'echarts/components'
import { SVGRenderer } from 'echarts/renderers'

use([LineChart, ScatterChart, GridComponent, LegendComponent, TooltipComponent, SVGRenderer])

export { init }
export type { ECharts } from 'echarts/core'
