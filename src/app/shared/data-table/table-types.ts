import type { SortDirection } from '../../../../shared/api/tables';

/** One column of a server-paged table: what it shows, and the server's sort key when it sorts. */
export interface TableColumn<T> {
  id: string;
  label: string;
  text(row: T): string;
  /** The server's sort key; without one the column does not sort. */
  sortKey?: string;
  /** A tone for a small badge (critical, urgent, watch, open, done…), styled by the table. */
  tone?(row: T): string | null;
}

export interface FilterOption {
  value: string;
  label: string;
}

/** A filter of the filter bar; its key is its name in the page's URL. */
export interface FilterField {
  key: string;
  label: string;
  kind: 'search' | 'select' | 'date-from' | 'date-to';
  options?: readonly FilterOption[];
  /** A select's value when the URL has none ('' reads "any"). */
  defaultValue?: string;
}

/** What the page's URL holds: sort, page and the filters as written in it. */
export interface TableState {
  sort: string;
  dir: SortDirection;
  page: number;
  pageSize: number;
  filters: Readonly<Record<string, string>>;
}

export const PAGE_SIZES = [10, 25, 50, 100] as const;
