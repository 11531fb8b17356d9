import { fleetAppliance, fleetProperty, sampleOverview } from './fleet-fixtures';
import { layoutFleet, neighbourCell } from './fleet-layout';
import { headlineTempC } from './unit-tile';

describe('layoutFleet', () => {
  it('puts a band row before each property’s tile rows, a unit per tile and its worst health on the tile', () => {
    const layout = layoutFleet(sampleOverview().properties, 10);
    expect(layout.rows.map((row) => row.kind)).toEqual(['band', 'tiles', 'band', 'tiles']);
    const firstTiles = layout.rows[1]!;
    expect(firstTiles.kind === 'tiles' && firstTiles.units.map((t) => [t.unit.label, t.health, t.firstCell])).toEqual([
      ['1A', 'warm', 0],
      ['2B', 'drifting', 1],
    ]);
    expect(layout.cells.length).toBe(5);
  });

  it('wraps units into rows of the given number of columns', () => {
    const many = fleetProperty('p', 'Long House', Array.from({ length: 7 }, (_, i) => ({ id: `u${i}`, label: `${i + 1}`, appliances: [fleetAppliance(`a${i}`, 'cold')] })));
    const layout = layoutFleet([many], 3);
    expect(layout.rows.map((row) => (row.kind === 'tiles' ? row.units.length : 'band'))).toEqual(['band', 3, 3, 1]);
    expect(layoutFleet([many], 0).rows.length).toBe(8); // at least one column
  });
});

describe('neighbourCell (arrow keys)', () => {
  const many = (id: string, count: number) => fleetProperty(id, id, Array.from({ length: count }, (_, i) => ({ id: `${id}u${i}`, label: `${i}`, appliances: [fleetAppliance(`${id}a${i}`, 'cold')] })));
  const layout = layoutFleet([many('A', 5), many('B', 2)], 3);
  // Rows: band A, [0 1 2], [3 4], band B, [5 6]

  it('moves left and right in reading order, and Home/End to the ends', () => {
    expect(neighbourCell(layout, 2, 'ArrowRight')).toBe(3);
    expect(neighbourCell(layout, 3, 'ArrowLeft')).toBe(2);
    expect(neighbourCell(layout, 0, 'ArrowLeft')).toBeNull();
    expect(neighbourCell(layout, 6, 'ArrowRight')).toBeNull();
    expect(neighbourCell(layout, 4, 'Home')).toBe(0);
    expect(neighbourCell(layout, 0, 'End')).toBe(6);
  });

  it('moves up and down keeping the column, across the band between properties, and to the last tile of a shorter row', () => {
    expect(neighbourCell(layout, 1, 'ArrowDown')).toBe(4);
    expect(neighbourCell(layout, 2, 'ArrowDown')).toBe(4);
    expect(neighbourCell(layout, 4, 'ArrowDown')).toBe(6);
    expect(neighbourCell(layout, 5, 'ArrowUp')).toBe(3);
    expect(neighbourCell(layout, 1, 'ArrowUp')).toBeNull();
  });
});

describe('headlineTempC (the tile’s temperature)', () => {
  it('shows the fresh food, unless a warm appliance has only its freezer past its limit (FDA: 40 °F / 0 °F)', () => {
    expect(headlineTempC(fleetAppliance('a', 'cold', { freshFoodC: 3.1, freezerC: -18 }))).toBe(3.1);
    expect(headlineTempC(fleetAppliance('a', 'cold', { freshFoodC: 3.1, freezerC: -16.5 }))).toBe(3.1); // a door or a defrost
    expect(headlineTempC(fleetAppliance('a', 'warm', { freshFoodC: 1.7, freezerC: -11.5 }))).toBe(-11.5);
    expect(headlineTempC(fleetAppliance('a', 'warm', { freshFoodC: 7, freezerC: -11.5 }))).toBe(7);
    expect(headlineTempC(fleetAppliance('a', 'cold', { freshFoodC: null, freezerC: -19 }))).toBe(-19);
    expect(headlineTempC(fleetAppliance('a', 'silent', { freshFoodC: null, freezerC: null }))).toBeNull();
  });
});
