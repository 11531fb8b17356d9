/**
 * TypeORM's postgres driver answers `UPDATE … RETURNING` with [rows, affectedCount] but a
 * SELECT with rows alone; this gives the rows either way.
 */
export function returnedRows<T>(result: unknown): T[] {
  if (Array.isArray(result) && result.length === 2 && Array.isArray(result[0]) && typeof result[1] === 'number') return result[0] as T[];
  return (result ?? []) as T[];
}
