/**
 * The fleet overview as rows of one height for the CDK virtual scroll: a band row per
 * property, then its units in rows of `columns` tiles. Each appliance is a cell, numbered
 * in reading order, so arrow keys can move between cells across rows and bands.
 */
import type { FleetProperty, FleetUnit } from '../../../shared/api/fleet';
import { worstHealth } from '../../../shared/api/fleet-constants';
import type { Health } from '../../../shared/domain';

export interface TileUnit {
  unit: FleetUnit;
  health: Health;
  /** Cell number of the unit's first appliance. */
  firstCell: number;
}

export type FleetRow = { kind: 'band'; key: string; property: FleetProperty } | { kind: 'tiles'; key: string; property: FleetProperty; units: TileUnit[] };

export interface CellPosition {
  row: number;
  column: number;
}

export interface FleetLayout {
  rows: FleetRow[];
  /** Position of each cell's unit tile, by cell number. */
  cells: CellPosition[];
}

export function layoutFleet(properties: readonly FleetProperty[], columns: number): FleetLayout {
  const perRow = Math.max(1, Math.floor(columns));
  const rows: FleetRow[] = [];
  const cells: CellPosition[] = [];
  for (const property of properties) {
    rows.push({ kind: 'band', key: `band-${property.id}`, property });
    for (let start = 0; start < property.units.length; start += perRow) {
      const units = property.units.slice(start, start + perRow).map((unit, column) => {
        const tile: TileUnit = { unit, health: worstHealth(unit.appliances.map((a) => a.health)), firstCell: cells.length };
        for (let i = 0; i < unit.appliances.length; i++) cells.push({ row: rows.length, column });
        return tile;
      });
      rows.push({ kind: 'tiles', key: `tiles-${property.id}-${start}`, property, units });
    }
  }
  return { rows, cells };
}

export type NavigationKey = 'ArrowLeft' | 'ArrowRight' | 'ArrowUp' | 'ArrowDown' | 'Home' | 'End';

export function isNavigationKey(key: string): key is NavigationKey {
  return ['ArrowLeft', 'ArrowRight', 'ArrowUp', 'ArrowDown', 'Home', 'End'].includes(key);
}

/** The cell to focus after a key, or null to stay. Up and down keep the column, across bands too. */
export function neighbourCell(layout: FleetLayout, cell: number, key: NavigationKey): number | null {
  const last = layout.cells.length - 1;
  if (last < 0) return null;
  if (key === 'Home') return 0;
  if (key === 'End') return last;
  if (key === 'ArrowLeft') return cell > 0 ? cell - 1 : null;
  if (key === 'ArrowRight') return cell < last ? cell + 1 : null;
  const here = layout.cells[cell];
  if (!here) return null;
  const step = key === 'ArrowDown' ? 1 : -1;
  for (let row = here.row + step; row >= 0 && row < layout.rows.length; row += step) {
    const target = layout.rows[row];
    if (target?.kind !== 'tiles') continue;
    const unit = target.units[Math.min(here.column, target.units.length - 1)];
    return unit ? unit.firstCell : null;
  }
  return null;
}
