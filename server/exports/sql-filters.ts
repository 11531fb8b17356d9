/**
 * The WHERE and ORDER BY of the manager's lists, built with numbered parameters: every
 * value goes in as a parameter and every sort key comes from a whitelist, so nothing a
 * caller sends is ever spliced into the SQL text.
 */
import type { SortDirection } from '../../shared/api/tables';

export class SqlFilters {
  private readonly conditions: string[] = [];

  constructor(readonly params: unknown[] = []) {}

  /** `$n` for a value, added to the parameters. */
  param(value: unknown): string {
    return `$${this.params.push(value)}`;
  }

  add(condition: string): this {
    this.conditions.push(condition);
    return this;
  }

  /** Adds the condition only when the filter was given. */
  when<T>(value: T | undefined, condition: (placeholder: string) => string): this {
    if (value !== undefined) this.add(condition(this.param(value)));
    return this;
  }

  /** Any of the expressions contains the text, case-insensitively (LIKE wildcards in the text are literal). */
  search(text: string | undefined, expressions: readonly string[]): this {
    if (!text) return this;
    const pattern = this.param(`%${text.replace(/[\\%_]/g, (c) => `\\${c}`)}%`);
    return this.add(`(${expressions.map((e) => `${e} ILIKE ${pattern}`).join(' OR ')})`);
  }

  /** Opened at or after `from` and before `to`. */
  range(column: string, from: string | undefined, to: string | undefined): this {
    this.when(from, (p) => `${column} >= ${p}::timestamptz`);
    return this.when(to, (p) => `${column} < ${p}::timestamptz`);
  }

  get where(): string {
    return this.conditions.length ? this.conditions.join(' AND ') : 'true';
  }
}

/** ORDER BY text for a whitelisted key; empty values sort last either way, ties by the table's own order. */
export function orderBy<K extends string>(keys: Readonly<Record<K, string>>, key: K, dir: SortDirection, tieBreak: string): string {
  return `${keys[key]} ${dir === 'desc' ? 'DESC' : 'ASC'} NULLS LAST, ${tieBreak}`;
}

/** SQL: the rank of a value in a fixed list, so "critical" sorts above "watch". */
export function rankOf(column: string, order: readonly string[]): string {
  return `array_position(ARRAY[${order.map((v) => `'${v.replace(/'/g, "''")}'`).join(',')}]::text[], ${column}::text)`;
}
