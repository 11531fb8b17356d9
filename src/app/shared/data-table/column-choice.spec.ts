import { ColumnChoice } from './column-choice';

class MemoryStorage {
  readonly items = new Map<string, string>();
  getItem(key: string): string | null {
    return this.items.get(key) ?? null;
  }
  setItem(key: string, value: string): void {
    this.items.set(key, value);
  }
}

const COLUMNS = [
  { id: 'a', label: 'A' },
  { id: 'b', label: 'B' },
  { id: 'c', label: 'C' },
];

describe('ColumnChoice', () => {
  it('starts from the defaults, remembers toggles in the table’s order, and never hides the last column', () => {
    const storage = new MemoryStorage();
    const choice = new ColumnChoice('cw.columns.spec', COLUMNS, ['a', 'b'], storage as unknown as Storage);
    expect(choice.visible()).toEqual(['a', 'b']);
    choice.toggle('c');
    choice.toggle('a');
    expect(choice.visible()).toEqual(['b', 'c']);
    choice.toggle('b');
    choice.toggle('c');
    expect(choice.visible()).withContext('the last column stays').toEqual(['c']);
    expect(new ColumnChoice('cw.columns.spec', COLUMNS, ['a'], storage as unknown as Storage).visible()).toEqual(['c']);
  });

  it('drops unknown ids and ignores a broken saved value', () => {
    const storage = new MemoryStorage();
    storage.setItem('k1', JSON.stringify(['gone', 'b']));
    storage.setItem('k2', '{not json');
    expect(new ColumnChoice('k1', COLUMNS, undefined, storage as unknown as Storage).visible()).toEqual(['b']);
    expect(new ColumnChoice('k2', COLUMNS, undefined, storage as unknown as Storage).visible()).toEqual(['a', 'b', 'c']);
  });
});
