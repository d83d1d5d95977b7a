import { LineChart, ScatterChart } from 'echarts/charts'
import { GridComponent, MarkAreaComponent, MarkLineComponent, TooltipComponent } from 'echarts/components'
import { use } from 'echarts/core'
import { SVGRenderer } from 'echarts/renderers'

// Only what the analysis charts draw, so the bundle stays small; SVG keeps lines crisp at any zoom.
use([LineChart, ScatterChart, GridComponent, TooltipComponent, MarkLineComponent, MarkAreaComponent, SVGRenderer])

export const chartText = { fontFamily: "'IBM Plex Sans', system-ui, sans-serif", color: '#1b2a41' }
