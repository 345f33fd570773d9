// One place registers the parts of ECharts the flight screen uses, so the bundle carries only those.
import { use } from 'echarts/core'
import { CanvasRenderer } from 'echarts/renderers'
import { LineChart, ScatterChart } from 'echarts/charts'
import {
  DataZoomComponent,
  GridComponent,
  LegendComponent,
  MarkAreaComponent,
  MarkLineComponent,
  MarkPointComponent,
  TitleComponent,
  TooltipComponent,
  GraphicComponent,
} from 'echarts/components'

use([
  CanvasRenderer,
  LineChart,
  ScatterChart,
  DataZoomComponent,
  GridComponent,
  LegendComponent,
  MarkAreaComponent,
  MarkLineComponent,
  MarkPointComponent,
  TitleComponent,
  TooltipComponent,
  GraphicComponent,
])

/** Shared look: Inter, quiet axes, tooltips drawn as rich text on the canvas (never as HTML). */
export const BASE_TEXT = { fontFamily: 'Inter, system-ui, sans-serif', color: '#334155' }
export const TOOLTIP_SAFE = { renderMode: 'richText' as const, confine: true }
