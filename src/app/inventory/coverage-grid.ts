/** The coverage rows as a grid: property × style (null: every style) × rank → contractor. */
import type { CoverageRank, CoverageView } from '../../../shared/api/work-orders';
import { APPLIANCE_STYLES, type ApplianceStyle } from '../../../shared/domain';
import { STYLE_LABELS } from './labels';

export interface StyleColumn {
  style: ApplianceStyle | null;
  label: string;
}

/** The property-wide column first: it covers every style without a row of its own. */
export const STYLE_COLUMNS: readonly StyleColumn[] = [{ style: null, label: 'Every style' }, ...APPLIANCE_STYLES.map((style) => ({ style, label: STYLE_LABELS[style] }))];

export function slotKey(propertyId: string, style: ApplianceStyle | null): string {
  return `${propertyId}|${style ?? 'every-style'}`;
}

export class CoverageGrid {
  private readonly byKey = new Map<string, CoverageView>();

  constructor(readonly rows: readonly CoverageView[]) {
    for (const row of rows) this.byKey.set(`${slotKey(row.propertyId, row.applianceStyle)}|${row.rank}`, row);
  }

  /** The slot's own row, if any. */
  row(propertyId: string, style: ApplianceStyle | null, rank: CoverageRank): CoverageView | null {
    return this.byKey.get(`${slotKey(propertyId, style)}|${rank}`) ?? null;
  }

  contractorId(propertyId: string, style: ApplianceStyle | null, rank: CoverageRank): string | null {
    return this.row(propertyId, style, rank)?.contractorId ?? null;
  }

  /** Who is dispatched for a style without its own row: the property-wide row's contractor. */
  fallbackName(propertyId: string, style: ApplianceStyle | null, rank: CoverageRank): string | null {
    return style === null ? null : (this.row(propertyId, null, rank)?.contractorName ?? null);
  }

  /** The grid after a save: that property's rows replaced by the server's answer. */
  withProperty(propertyId: string, rows: readonly CoverageView[]): CoverageGrid {
    return new CoverageGrid([...this.rows.filter((row) => row.propertyId !== propertyId), ...rows.filter((row) => row.propertyId === propertyId)]);
  }
}
