import { useState } from 'react';
import {
  flexRender,
  getCoreRowModel,
  getPaginationRowModel,
  getSortedRowModel,
  useReactTable,
  type ColumnDef,
  type SortingState,
} from '@tanstack/react-table';
import { Button, ScrollRegion, cx } from '@/components/ui';

const SORT_WORDS = { asc: 'ascending', desc: 'descending' } as const;

/**
 * The admin desk's tables: sortable headers (buttons, with aria-sort on the header cell) and paging.
 * Rows come from one server answer; sorting and paging happen here.
 */
export function DataTable<T>({
  data,
  columns,
  caption,
  pageSize = 20,
  initialSorting = [],
  rowTestId,
}: {
  data: T[];
  // Columns of mixed value types: the cell renderers type each one.
  columns: ColumnDef<T, any>[];
  caption: string;
  pageSize?: number;
  initialSorting?: SortingState;
  rowTestId?: string;
}) {
  const [sorting, setSorting] = useState<SortingState>(initialSorting);
  const table = useReactTable({
    data,
    columns,
    state: { sorting },
    onSortingChange: setSorting,
    getCoreRowModel: getCoreRowModel(),
    getSortedRowModel: getSortedRowModel(),
    getPaginationRowModel: getPaginationRowModel(),
    initialState: { pagination: { pageSize } },
  });
  const { pageIndex } = table.getState().pagination;
  const pages = table.getPageCount();
  return (
    <div className="space-y-3">
      <ScrollRegion label={caption} className="rounded-xl border border-line bg-canvas-raised">
        <table className="w-full border-collapse text-left text-sm">
          <caption className="sr-only">{caption}</caption>
          <thead className="bg-canvas-sunken">
            {table.getHeaderGroups().map((group) => (
              <tr key={group.id}>
                {group.headers.map((header) => {
                  const sorted = header.column.getIsSorted();
                  return (
                    <th key={header.id} scope="col" aria-sort={sorted ? SORT_WORDS[sorted] : undefined} className="px-3 py-2 font-bold whitespace-nowrap">
                      {header.isPlaceholder ? null : header.column.getCanSort() ? (
                        <button type="button" className="inline-flex items-center gap-1 hover:underline" onClick={header.column.getToggleSortingHandler()}>
                          {flexRender(header.column.columnDef.header, header.getContext())}
                          <span aria-hidden="true">{sorted === 'asc' ? '▲' : sorted === 'desc' ? '▼' : '↕'}</span>
                        </button>
                      ) : (
                        flexRender(header.column.columnDef.header, header.getContext())
                      )}
                    </th>
                  );
                })}
              </tr>
            ))}
          </thead>
          <tbody>
            {table.getRowModel().rows.map((row) => (
              <tr key={row.id} className="border-t border-line align-top" data-testid={rowTestId}>
                {row.getVisibleCells().map((cell) => (
                  <td key={cell.id} className="px-3 py-2">
                    {flexRender(cell.column.columnDef.cell, cell.getContext())}
                  </td>
                ))}
              </tr>
            ))}
          </tbody>
        </table>
      </ScrollRegion>
      {pages > 1 ? (
        <nav aria-label={`${caption}: pages`} className={cx('flex items-center gap-3')}>
          <Button variant="secondary" size="sm" onClick={() => table.previousPage()} disabled={!table.getCanPreviousPage()}>
            Previous
          </Button>
          <span className="text-sm text-ink-muted">
            Page {pageIndex + 1} of {pages}
          </span>
          <Button variant="secondary" size="sm" onClick={() => table.nextPage()} disabled={!table.getCanNextPage()}>
            Next
          </Button>
        </nav>
      ) : null}
    </div>
  );
}
