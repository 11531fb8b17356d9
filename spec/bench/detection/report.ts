/** Turns scenario outcomes into the benchmark's figures and its printed table. */
import { PropertyCorrelator, type ApplianceFinding } from '../../../server/detection/property-correlator';
import { VISIT_AFTER_MS, type DetectorOutcome, type ScenarioOutcome } from './evaluate';
import { APPLIANCE_FAULTS, DAY_MS, HOUR_MS } from './scenarios';

type Detector = 'engine' | 'thermometer';

export interface FaultRow {
  fault: string;
  count: number;
  visible: number;
  detected: number;
  detectedVisible: number;
  /** Faults that put food at risk (2 h above 40 °F in one spell), and those detected before that. */
  foodAtRisk: number;
  beforeFoodAtRisk: number;
  medianHours: number | null;
  top1AtOpen: number;
  top1AtVisit: number;
  top1Final: number;
}

interface FaultCase {
  fault: string;
  visible: boolean;
  onsetMs: number;
  foodAtRiskAtMs: number | null;
  outcome: DetectorOutcome;
}

function median(values: number[]): number | null {
  if (!values.length) return null;
  const sorted = [...values].sort((a, b) => a - b);
  const mid = sorted.length >> 1;
  return sorted.length % 2 ? sorted[mid] : (sorted[mid - 1] + sorted[mid]) / 2;
}

function row(fault: string, cases: FaultCase[]): FaultRow {
  const detected = cases.filter((c) => c.outcome.first !== null);
  const atRisk = cases.filter((c) => c.foodAtRiskAtMs !== null);
  const before = atRisk.filter((c) => c.outcome.first !== null && c.outcome.first.detectedAtMs < (c.foodAtRiskAtMs as number));
  const code = (c: FaultCase) => c.fault;
  return {
    fault,
    count: cases.length,
    visible: cases.filter((c) => c.visible).length,
    detected: detected.length,
    detectedVisible: detected.filter((c) => c.visible).length,
    foodAtRisk: atRisk.length,
    beforeFoodAtRisk: before.length,
    medianHours: median(detected.map((c) => (c.outcome.first!.detectedAtMs - c.onsetMs) / HOUR_MS)),
    top1AtOpen: detected.filter((c) => c.outcome.first!.topCauseAtOpen === code(c)).length,
    top1AtVisit: detected.filter((c) => c.outcome.first!.topCauseAtVisit === code(c)).length,
    top1Final: detected.filter((c) => c.outcome.first!.topCauseFinal === code(c)).length,
  };
}

function applianceCases(outcomes: ScenarioOutcome[], detector: Detector): FaultCase[] {
  return outcomes
    .filter((o) => o.scenario.group === 'appliance-fault')
    .map((o) => ({ fault: o.scenario.fault as string, visible: o.visible, onsetMs: o.scenario.onsetMs as number, foodAtRiskAtMs: o.foodAtRiskAtMs, outcome: o[detector] }));
}

/** One case per property: the engine's correlator, or the first unit alarm of the thermometer. */
function propertyCases(outcomes: ScenarioOutcome[], detector: Detector): FaultCase[] {
  const byProperty = new Map<string, ScenarioOutcome[]>();
  for (const o of outcomes.filter((x) => x.scenario.group === 'power-loss')) {
    const id = o.scenario.propertyId as string;
    byProperty.set(id, [...(byProperty.get(id) ?? []), o]);
  }
  const correlator = new PropertyCorrelator();
  return [...byProperty.entries()].map(([propertyId, units]) => {
    const onsetMs = units[0].scenario.onsetMs as number;
    const risks = units.map((u) => u.foodAtRiskAtMs).filter((t): t is number => t !== null);
    const foodAtRiskAtMs = risks.length ? Math.min(...risks) : null;
    const visible = units.some((u) => u.visible);
    if (detector === 'thermometer') {
      const firsts = units.map((u) => u.thermometer.first?.detectedAtMs).filter((t): t is number => t !== undefined);
      const first = firsts.length ? { detectedAtMs: Math.min(...firsts), topCauseAtOpen: null, topCauseAtVisit: null, topCauseFinal: null } : null;
      return { fault: 'power-loss', visible, onsetMs, foodAtRiskAtMs, outcome: { first, falseRepair: 0, sensorFaultFound: false } };
    }
    // The first unit finding alerts the manager; the correlator then names the cause for the property.
    const findings: ApplianceFinding[] = units.flatMap((u) => u.findings.map((finding) => ({ applianceId: u.scenario.id, finding })));
    const episode = correlator.correlate(propertyId, findings, units.length).find((e) => e.finding.detectedAtMs >= onsetMs);
    const unitFirsts = units.map((u) => u.engine.first?.detectedAtMs).filter((t): t is number => t !== undefined);
    const named = (atMs: number) => (episode && episode.finding.detectedAtMs <= atMs ? ('power-loss' as const) : null);
    const detectedAtMs = unitFirsts.length ? Math.min(...unitFirsts) : null;
    const first =
      detectedAtMs === null
        ? null
        : { detectedAtMs, topCauseAtOpen: named(detectedAtMs), topCauseAtVisit: named(detectedAtMs + VISIT_AFTER_MS), topCauseFinal: episode ? ('power-loss' as const) : null };
    return { fault: 'power-loss', visible, onsetMs, foodAtRiskAtMs, outcome: { first, falseRepair: 0, sensorFaultFound: false } };
  });
}

export interface DetectorFigures {
  rows: FaultRow[];
  total: FaultRow;
  healthyDays: number;
  falseRepairPer100Days: number;
  falseBeforeOnsetPer100Days: number;
  sensorTraces: number;
  sensorRecognised: number;
  sensorFalseDispatches: number;
}

function sumRows(rows: FaultRow[], cases: FaultCase[]): FaultRow {
  return { ...row('all faults', cases), fault: 'all faults', count: rows.reduce((s, r) => s + r.count, 0) };
}

export function figures(outcomes: ScenarioOutcome[], detector: Detector): DetectorFigures {
  const appliance = applianceCases(outcomes, detector);
  const properties = propertyCases(outcomes, detector);
  const rows = [...APPLIANCE_FAULTS.map((fault) => row(fault, appliance.filter((c) => c.fault === fault))), row('power-loss (property)', properties)];
  const healthy = outcomes.filter((o) => o.scenario.group === 'healthy');
  const healthyDays = healthy.reduce((s, o) => s + o.scenario.durationMs / DAY_MS, 0);
  const faulted = outcomes.filter((o) => o.scenario.onsetMs !== null);
  const preOnsetDays = faulted.reduce((s, o) => s + ((o.scenario.onsetMs as number) - o.scenario.startMs) / DAY_MS, 0);
  const sensor = outcomes.filter((o) => o.scenario.group === 'sensor-fault');
  return {
    rows,
    total: sumRows(rows, [...appliance, ...properties]),
    healthyDays,
    falseRepairPer100Days: (100 * healthy.reduce((s, o) => s + o[detector].falseRepair, 0)) / healthyDays,
    falseBeforeOnsetPer100Days: (100 * faulted.reduce((s, o) => s + o[detector].falseRepair, 0)) / preOnsetDays,
    sensorTraces: sensor.length,
    sensorRecognised: sensor.filter((o) => o[detector].sensorFaultFound).length,
    sensorFalseDispatches: sensor.filter((o) => o[detector].first !== null).length,
  };
}

function pct(part: number, whole: number): string {
  return whole ? `${((100 * part) / whole).toFixed(0)} %` : '–';
}

function hours(value: number | null): string {
  return value === null ? '–' : `${value.toFixed(1)} h`;
}

function faultTable(title: string, f: DetectorFigures, withCauses: boolean): string[] {
  const header = ['fault', 'n', 'visible', 'detected', 'det. of visible', 'food at risk', 'detected before', 'median onset→detection', ...(withCauses ? ['top-1 at detection', 'top-1 at visit (+6 h)', 'top-1 at end'] : [])];
  const lines = [title, header.join(' | ')];
  for (const r of [...f.rows, f.total]) {
    const cells = [r.fault, `${r.count}`, `${r.visible}`, pct(r.detected, r.count), pct(r.detectedVisible, r.visible), `${r.foodAtRisk}`, pct(r.beforeFoodAtRisk, r.foodAtRisk), hours(r.medianHours)];
    if (withCauses) cells.push(pct(r.top1AtOpen, r.detected), pct(r.top1AtVisit, r.detected), pct(r.top1Final, r.detected));
    lines.push(cells.join(' | '));
  }
  return lines;
}

export function formatReport(engine: DetectorFigures, thermometer: DetectorFigures): string {
  const lines = [
    ...faultTable('Detection engine', engine, true),
    '',
    ...faultTable('Plain thermometer alarm (probe over its limit for 30 min)', thermometer, false),
    '',
    ['measure', 'engine', 'thermometer', 'target'].join(' | '),
    ['faults detected', pct(engine.total.detected, engine.total.count), pct(thermometer.total.detected, thermometer.total.count), '≥ 95 %'].join(' | '),
    ['faults detected (visible ones)', pct(engine.total.detectedVisible, engine.total.visible), pct(thermometer.total.detectedVisible, thermometer.total.visible), ''].join(' | '),
    [`detected before food at risk (of the ${engine.total.foodAtRisk} faults that put food at risk)`, pct(engine.total.beforeFoodAtRisk, engine.total.foodAtRisk), pct(thermometer.total.beforeFoodAtRisk, thermometer.total.foodAtRisk), '≥ 80 %'].join(' | '),
    [`false repair findings per 100 appliance-days (healthy, ${engine.healthyDays.toFixed(0)} days)`, engine.falseRepairPer100Days.toFixed(2), thermometer.falseRepairPer100Days.toFixed(2), '≤ 0.5'].join(' | '),
    ['false repair findings per 100 appliance-days (fault traces before onset)', engine.falseBeforeOnsetPer100Days.toFixed(2), thermometer.falseBeforeOnsetPer100Days.toFixed(2), ''].join(' | '),
    ['top-1 cause accuracy at the visit (work order 6 h after detection)', pct(engine.total.top1AtVisit, engine.total.detected), '–', '≥ 70 %'].join(' | '),
    ['top-1 cause accuracy at detection', pct(engine.total.top1AtOpen, engine.total.detected), '–', ''].join(' | '),
    ['top-1 cause accuracy at the end of the trace', pct(engine.total.top1Final, engine.total.detected), '–', ''].join(' | '),
    ['sensor faults recognised', `${engine.sensorRecognised}/${engine.sensorTraces}`, `${thermometer.sensorRecognised}/${thermometer.sensorTraces}`, ''].join(' | '),
    ['false dispatches on sensor faults', `${engine.sensorFalseDispatches}`, `${thermometer.sensorFalseDispatches}`, '0'].join(' | '),
  ];
  return lines.join('\n');
}
