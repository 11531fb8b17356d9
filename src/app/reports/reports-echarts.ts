// Only the echarts pieces the reports' bar charts use, so the bundle carries nothing else.
// Imported lazily by the first report chart, inside the reports route.
import { BarChart } from 'echarts/charts';
import { GridComponent, TooltipComponent } from 'echarts/components';
import * as echarts from 'echarts/core';
import { CanvasRenderer } from 'echarts/renderers';

echarts.use([BarChart, GridComponent, TooltipComponent, CanvasRenderer]);

export default echarts;
