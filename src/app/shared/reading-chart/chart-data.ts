import type { Probe } from '../../../../shared/domain';

/** What the reading chart draws; built from a history answer or a logger file. */
export interface ChartProbeSeries {
  /** [epoch ms, °C] */
  points: [number, number][];
  /** [epoch ms, min °C, max °C] per rollup bucket, or null for raw points. */
  envelope: [number, number, number][] | null;
}

export interface ChartSpan {
  startMs: number;
  /** null while still open: drawn to the end of the range. */
  endMs: number | null;
  label: string;
}

export interface ChartForecast {
  probe: Probe;
  fromMs: number;
  fromC: number;
  crossingMs: number;
  limitC: number;
}

export interface ReadingChartData {
  probes: Partial<Record<Probe, ChartProbeSeries>>;
  incidents?: ChartSpan[];
  defrosts?: { atMs: number; probe: Probe }[];
  forecast?: ChartForecast | null;
}

/** Colours the chart takes from the theme's custom properties at draw time. */
export interface ChartPalette {
  freshFood: string;
  freezer: string;
  limit: string;
  incident: string;
  text: string;
  grid: string;
}
