// A chart.js plugin that draws labelled reference lines across a chart: "now" on the season
// timeline, "colonies owned" on the beekeeper's weekly chart. Options come per chart under
// plugins.referenceLines.lines.
import type { Chart, Plugin } from 'chart.js';

export interface ReferenceLine {
  /** The scale the value is on: a vertical line for 'x', a horizontal one for 'y'. */
  scale: 'x' | 'y';
  value: number;
  color: string;
  label: string;
}

declare module 'chart.js' {
  interface PluginOptionsByType<TType> {
    referenceLines?: { lines: ReferenceLine[]; font?: string };
  }
}

export const referenceLinePlugin: Plugin = {
  id: 'referenceLines',
  afterDatasetsDraw(chart: Chart, _args, options: { lines?: ReferenceLine[]; font?: string }) {
    const { ctx, chartArea } = chart;
    for (const line of options.lines ?? []) {
      const scale = chart.scales[line.scale];
      if (!scale) continue;
      const at = scale.getPixelForValue(line.value);
      const vertical = line.scale === 'x';
      if (vertical ? at < chartArea.left || at > chartArea.right : at < chartArea.top || at > chartArea.bottom) continue;
      ctx.save();
      ctx.strokeStyle = line.color;
      ctx.lineWidth = 2;
      ctx.setLineDash([6, 4]);
      ctx.beginPath();
      if (vertical) {
        ctx.moveTo(at, chartArea.top);
        ctx.lineTo(at, chartArea.bottom);
      } else {
        ctx.moveTo(chartArea.left, at);
        ctx.lineTo(chartArea.right, at);
      }
      ctx.stroke();
      ctx.setLineDash([]);
      ctx.font = options.font ?? '600 12px "Work Sans", sans-serif';
      const width = ctx.measureText(line.label).width + 10;
      const x = vertical ? Math.min(at + 2, chartArea.right - width) : chartArea.right - width;
      const y = vertical ? chartArea.top + 2 : at - 20;
      ctx.fillStyle = line.color;
      ctx.fillRect(x, y, width, 18);
      ctx.fillStyle = '#ffffff';
      ctx.textBaseline = 'middle';
      ctx.fillText(line.label, x + 5, y + 9);
      ctx.restore();
    }
  },
};
