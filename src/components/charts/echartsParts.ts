// Only the ECharts parts the reorder charts draw with, registered once: line and bar series on a canvas,
// grid, tooltip, legend and the horizontal reorder point / safety stock lines. The whole library is much larger.
import { use } from 'echarts/core'
import { CanvasRenderer } from 'echarts/renderers'
import { BarChart, LineChart } from 'echarts/charts'
import { GridComponent, LegendComponent, MarkLineComponent, TooltipComponent } from 'echarts/components'

use([CanvasRenderer, LineChart, BarChart, GridComponent, TooltipComponent, LegendComponent, MarkLineComponent])

/** Our palette (src/assets/theme.css) for series. */
export const CHART_COLORS = { lagoon: '#14505c', glass: '#7fa2a9', amber: '#f2b441', danger: '#b4232c', ink: '#4a5d63' }
export const CHART_FONT = { fontFamily: 'Open Sans, system-ui, sans-serif' }
