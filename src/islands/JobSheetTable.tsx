// The job sheet list as a table: rendered on the server for everyone; once hydrated, sortable and filterable in place.
import { useEffect, useMemo, useState } from 'react';
import {
  flexRender,
  getCoreRowModel,
  getFilteredRowModel,
  getSortedRowModel,
  useReactTable,
  type ColumnDef,
  type SortingState,
} from '@tanstack/react-table';

export interface JobSheetRow {
  id: number;
  customerRef: string;
  machine: string | null;
  status: string;
  statusLabel: string;
  /** ISO dates: the island's props must survive serialisation. */
  bookedInAt: string;
  updatedAt: string;
  fixCount: number;
}

interface Props {
  rows: JobSheetRow[];
}

const shortDate = (iso: string): string =>
  new Date(iso).toLocaleDateString('en-GB', { day: 'numeric', month: 'short', year: 'numeric', timeZone: 'UTC' });

const columns: ColumnDef<JobSheetRow>[] = [
  {
    accessorKey: 'customerRef',
    header: 'Customer reference',
    cell: (info) => (
      <a className="text-teal underline" href={`/jobs/${info.row.original.id}`}>
        {info.row.original.customerRef}
      </a>
    ),
  },
  { accessorKey: 'machine', header: 'Machine', cell: (info) => info.row.original.machine ?? '–' },
  { accessorKey: 'statusLabel', header: 'Status' },
  { accessorKey: 'bookedInAt', header: 'Booked in', cell: (info) => shortDate(info.row.original.bookedInAt) },
  { accessorKey: 'updatedAt', header: 'Last change', cell: (info) => shortDate(info.row.original.updatedAt) },
  { accessorKey: 'fixCount', header: 'Fixes' },
];

export default function JobSheetTable({ rows }: Props) {
  // Sorting and the quick filter need JavaScript; until it runs, the server's order and filters apply.
  const [hydrated, setHydrated] = useState(false);
  const [sorting, setSorting] = useState<SortingState>([]);
  const [globalFilter, setGlobalFilter] = useState('');
  useEffect(() => setHydrated(true), []);
  const data = useMemo(() => rows, [rows]);
  const table = useReactTable({
    data,
    columns,
    state: { sorting, globalFilter },
    onSortingChange: setSorting,
    onGlobalFilterChange: setGlobalFilter,
    getCoreRowModel: getCoreRowModel(),
    getSortedRowModel: getSortedRowModel(),
    getFilteredRowModel: getFilteredRowModel(),
  });
  const shown = table.getRowModel().rows;
  return (
    <div className="font-sans text-sm">
      {hydrated && (
        <p className="mb-2">
          <label className="mr-2 font-semibold" htmlFor="job-quick-filter">
            Quick filter
          </label>
          <input
            id="job-quick-filter"
            className="input inline-block w-64"
            value={globalFilter}
            onChange={(e) => setGlobalFilter(e.target.value)}
            placeholder="Customer, machine, status…"
          />
        </p>
      )}
      <div className="table-scroll" role="region" aria-label="Your job sheets" tabIndex={0}>
        <table className="w-full">
          <caption className="sr-only">Your job sheets</caption>
          <thead className="bg-paper-deep text-left">
            {table.getHeaderGroups().map((group) => (
              <tr key={group.id}>
                {group.headers.map((header) => {
                  const label = flexRender(header.column.columnDef.header, header.getContext());
                  const sorted = header.column.getIsSorted();
                  return (
                    <th
                      key={header.id}
                      scope="col"
                      className="p-2"
                      aria-sort={sorted === 'asc' ? 'ascending' : sorted === 'desc' ? 'descending' : undefined}
                    >
                      {hydrated ? (
                        <button type="button" className="tap font-semibold text-teal" onClick={header.column.getToggleSortingHandler()}>
                          {label}
                          {sorted === 'asc' ? ' ▲' : sorted === 'desc' ? ' ▼' : ''}
                        </button>
                      ) : (
                        label
                      )}
                    </th>
                  );
                })}
              </tr>
            ))}
          </thead>
          <tbody>
            {shown.map((row) => (
              <tr key={row.id} className="border-b border-rule">
                {row.getVisibleCells().map((cell) => (
                  <td key={cell.id} className="p-2">
                    {flexRender(cell.column.columnDef.cell, cell.getContext())}
                  </td>
                ))}
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      {shown.length === 0 && <p className="mt-3 text-ink-soft">No job sheet matches.</p>}
    </div>
  );
}
