import { useEffect, useId, useMemo, type ReactNode } from 'react';
import {
  columnFilteringFeature,
  createColumnHelper,
  createFilteredRowModel,
  createPaginatedRowModel,
  createSortedRowModel,
  filterFn_arrIncludes,
  filterFn_includesString,
  functionalUpdate,
  globalFilteringFeature,
  metaHelper,
  rowPaginationFeature,
  rowSortingFeature,
  sortFn_alphanumeric,
  sortFn_datetime,
  sortFn_text,
  tableFeatures,
  useTable,
  type ColumnDef,
  type ColumnFiltersState,
  type PaginationState,
  type Row,
  type RowData,
  type SortingState,
  type Updater,
} from '@tanstack/react-table';
import { cn } from '../../utils/cn.ts';
import { Button } from './button.tsx';
import { Select } from './field.tsx';

export interface DataColumnMeta {
  /** Label for the phone (card) layout when the header is not plain text. */
  label?: string;
  /** Words for the two sort directions in the phone sort menu, e.g. ["Oldest first", "Newest first"]. */
  sortLabels?: readonly [ascending: string, descending: string];
  cellClassName?: string;
}

/** The one feature set every DataTable uses: client-side sort, filter and paginate. */
export const dataTableFeatures = tableFeatures({
  columnMeta: metaHelper<DataColumnMeta>(),
  rowSortingFeature,
  sortedRowModel: createSortedRowModel(),
  sortFns: { alphanumeric: sortFn_alphanumeric, text: sortFn_text, datetime: sortFn_datetime },
  columnFilteringFeature,
  globalFilteringFeature,
  filteredRowModel: createFilteredRowModel(),
  filterFns: { includesString: filterFn_includesString, arrIncludes: filterFn_arrIncludes },
  rowPaginationFeature,
  paginatedRowModel: createPaginatedRowModel(),
});

export type DataTableFeatures = typeof dataTableFeatures;
export type DataTableColumn<TData extends RowData> = ColumnDef<DataTableFeatures, TData, any>;

/** Column helper typed for DataTable: `const col = dataTableColumns<MemberRow>(); col.columns([col.accessor('name', …)])`. */
export const dataTableColumns = <TData extends RowData>() => createColumnHelper<DataTableFeatures, TData>();

export interface DataTableProps<TData extends RowData> {
  /** Names the table for screen readers (visually hidden). */
  caption: string;
  data: TData[];
  columns: DataTableColumn<TData>[];
  getRowId: (row: TData) => string;
  /** Free-text search, owned by the page's filter controls. */
  globalFilter?: string;
  /** The text a row is searched by (e.g. name and e-mail); without it the search covers every text column. */
  searchText?: (row: TData) => string;
  columnFilters?: ColumnFiltersState;
  initialSorting?: SortingState;
  /**
   * Sorting and page owned by the page (e.g. kept in the address so Back and reload keep them); without them the
   * table keeps its own, starting from `initialSorting` and the first page. A controlled page index past the last
   * page is brought back to the last one through `onPageIndexChange(last, true)`, which is no step for Back.
   */
  sorting?: SortingState;
  onSortingChange?: (sorting: SortingState) => void;
  pageIndex?: number;
  onPageIndexChange?: (pageIndex: number, pastTheEnd?: boolean) => void;
  pageSize?: number;
  /** Shown instead of rows when nothing matches. */
  emptyMessage: ReactNode;
  /** ["member", "members"] for "Showing 1–25 of 60 members". */
  noun: readonly [singular: string, plural: string];
}

const NO_FILTERS: ColumnFiltersState = [];
const NO_SORTING: SortingState = [];
const ignoreChange = () => {};

function columnIdOf(column: { id?: string; accessorKey?: unknown } | undefined): string | undefined {
  if (!column) return undefined;
  return column.id ?? (typeof column.accessorKey === 'string' ? column.accessorKey.replaceAll('.', '_') : undefined);
}

/**
 * A table that becomes a stack of cards on phones. Sorting is by header buttons
 * (a "Sort by" menu on phones); filters come from the page; 25 rows a page by default.
 */
export function DataTable<TData extends RowData>({
  caption,
  data,
  columns,
  getRowId,
  globalFilter = '',
  searchText,
  columnFilters = NO_FILTERS,
  initialSorting = NO_SORTING,
  sorting,
  onSortingChange,
  pageIndex: controlledPageIndex,
  onPageIndexChange,
  pageSize = 25,
  emptyMessage,
  noun,
}: DataTableProps<TData>) {
  const sortMenuId = useId();
  const firstColumnId = columnIdOf(columns[0]);
  const state = useMemo(
    () => ({
      globalFilter,
      columnFilters,
      ...(sorting ? { sorting } : {}),
      ...(controlledPageIndex !== undefined ? { pagination: { pageIndex: controlledPageIndex, pageSize } } : {}),
    }),
    [globalFilter, columnFilters, sorting, controlledPageIndex, pageSize],
  );
  const table = useTable({
    features: dataTableFeatures,
    columns,
    data,
    getRowId,
    ...(searchText
      ? {
          // Test each row once, on the first column, against its own search text.
          globalFilterFn: (row: Row<DataTableFeatures, TData>, _columnId: string, query: unknown) =>
            searchText(row.original).toLocaleLowerCase().includes(String(query).trim().toLocaleLowerCase()),
          getColumnCanGlobalFilter: (column: { id: string }) => column.id === firstColumnId,
        }
      : { globalFilterFn: 'includesString' as const }),
    state,
    onGlobalFilterChange: ignoreChange,
    onColumnFiltersChange: ignoreChange,
    ...(sorting && onSortingChange ? { onSortingChange: (updater: Updater<SortingState>) => onSortingChange(functionalUpdate(updater, sorting)) } : {}),
    ...(controlledPageIndex !== undefined
      ? {
          onPaginationChange: (updater: Updater<PaginationState>) =>
            onPageIndexChange?.(functionalUpdate(updater, { pageIndex: controlledPageIndex, pageSize }).pageIndex),
          // The page owns the page number (it starts again at the first page when its filters change).
          autoResetPageIndex: false,
        }
      : {}),
    enableSortingRemoval: false,
    initialState: { sorting: initialSorting, pagination: { pageIndex: 0, pageSize } },
  });

  const { pageIndex } = table.state.pagination;
  const total = table.getPrePaginatedRowModel().rows.length;
  const rows = table.getRowModel().rows;
  const first = total === 0 ? 0 : pageIndex * pageSize + 1;
  const last = pageIndex * pageSize + rows.length;
  const pageCount = Math.max(table.getPageCount(), 1);
  // A page kept in the address may be past the end once rows have gone (a bundle reviewed, a filter applied).
  const pastTheEnd = controlledPageIndex !== undefined && controlledPageIndex > pageCount - 1;
  useEffect(() => {
    if (pastTheEnd) onPageIndexChange?.(pageCount - 1, true);
  }, [pastTheEnd, pageCount, onPageIndexChange]);
  const nounFor = (n: number) => (n === 1 ? noun[0] : noun[1]);

  const leafColumns = table.getAllLeafColumns();
  const labelOf = (column: (typeof leafColumns)[number]): string => {
    const header = column.columnDef.header;
    return typeof header === 'string' ? header : (column.columnDef.meta?.label ?? column.id);
  };
  const sortOptions = leafColumns
    .filter((column) => column.getCanSort())
    .flatMap((column) => {
      const [ascending, descending] = column.columnDef.meta?.sortLabels ?? ['A to Z', 'Z to A'];
      return [
        { value: `${column.id}:asc`, label: `${labelOf(column)}: ${ascending}` },
        { value: `${column.id}:desc`, label: `${labelOf(column)}: ${descending}` },
      ];
    });
  const currentSort = table.state.sorting[0];

  return (
    <div className="space-y-4">
      <div className="flex flex-wrap items-end justify-between gap-3">
        <p role="status" className="font-semibold">
          {total === 0 ? `No ${noun[1]} to show` : `Showing ${first}–${last} of ${total} ${nounFor(total)}`}
        </p>
        {sortOptions.length > 0 ? (
          <div className="w-full md:hidden">
            <label htmlFor={sortMenuId} className="block font-semibold">
              Sort by
            </label>
            <Select
              id={sortMenuId}
              options={sortOptions}
              value={currentSort ? `${currentSort.id}:${currentSort.desc ? 'desc' : 'asc'}` : ''}
              onChange={(event) => {
                const [id = '', direction] = event.target.value.split(':');
                table.setSorting([{ id, desc: direction === 'desc' }]);
              }}
            />
          </div>
        ) : null}
      </div>

      <table role="table" className="block w-full border-collapse md:table">
        <caption className="sr-only">{caption}</caption>
        <thead role="rowgroup" className="max-md:hidden">
          {table.getHeaderGroups().map((group) => (
            <tr role="row" key={group.id} className="border-b-2 border-thread">
              {group.headers.map((header) => {
                const sorted = header.column.getIsSorted();
                return (
                  <th
                    role="columnheader"
                    key={header.id}
                    scope="col"
                    aria-sort={header.column.getCanSort() ? (sorted === 'asc' ? 'ascending' : sorted === 'desc' ? 'descending' : 'none') : undefined}
                    className="px-3 py-2 text-left align-bottom font-bold"
                  >
                    {header.isPlaceholder ? null : header.column.getCanSort() ? (
                      <button
                        type="button"
                        // No argument: the table picks the next direction (a column's first sort may be descending, e.g. newest first).
                        onClick={() => header.column.toggleSorting()}
                        className="inline-flex min-h-11 items-center gap-2 rounded-stitch px-1 font-bold hover:bg-linen-deep"
                      >
                        <table.FlexRender header={header} />
                        <span aria-hidden="true" className="text-madder-deep">
                          {sorted === 'asc' ? '▲' : sorted === 'desc' ? '▼' : '↕'}
                        </span>
                      </button>
                    ) : (
                      <span className="inline-flex min-h-11 items-center px-1">
                        <table.FlexRender header={header} />
                      </span>
                    )}
                  </th>
                );
              })}
            </tr>
          ))}
        </thead>
        <tbody role="rowgroup" className="block space-y-4 md:table-row-group md:space-y-0">
          {rows.length === 0 ? (
            <tr role="row" className="block md:table-row">
              <td role="cell" colSpan={leafColumns.length} className="block px-3 py-6 text-thread-soft md:table-cell">
                {emptyMessage}
              </td>
            </tr>
          ) : (
            rows.map((row) => (
              <tr
                role="row"
                key={row.id}
                className="block rounded-stitch border-2 border-seam bg-muslin p-3 md:table-row md:rounded-none md:border-0 md:border-b md:border-seam md:bg-transparent md:p-0 md:even:bg-muslin/70"
              >
                {row.getAllCells().map((cell) => (
                  <td role="cell" key={cell.id} className={cn('block px-1 py-2 align-top md:table-cell md:px-3 md:py-3', cell.column.columnDef.meta?.cellClassName)}>
                    <span aria-hidden="true" className="block text-base font-semibold text-thread-soft md:hidden">
                      {labelOf(cell.column)}
                    </span>
                    <table.FlexRender cell={cell} />
                  </td>
                ))}
              </tr>
            ))
          )}
        </tbody>
      </table>

      {pageCount > 1 ? (
        <nav aria-label={`${caption}: pages`} className="flex flex-wrap items-center justify-between gap-3">
          <Button variant="secondary" onClick={() => table.previousPage()} disabled={!table.getCanPreviousPage()}>
            ← Previous page
          </Button>
          <p className="font-semibold">
            Page {pageIndex + 1} of {pageCount}
          </p>
          <Button variant="secondary" onClick={() => table.nextPage()} disabled={!table.getCanNextPage()}>
            Next page →
          </Button>
        </nav>
      ) : null}
    </div>
  );
}
