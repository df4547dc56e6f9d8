import { useEffect, useMemo, useRef, useState } from 'react';
import { createColumnHelper, flexRender, getCoreRowModel, useReactTable, type SortingState } from '@tanstack/react-table';
import type { DeskPage } from '~/lib/review/current-design.server';
import { BRIEF_STATES } from '~/lib/briefs/states';
import { ES1_DC_LIMIT_V } from '~/lib/engine/cautions';
import { formatSi } from '~/lib/engine/units';
import { formatDate, formatMoney } from '~/lib/platform/format';
import { percent, TOPOLOGY_NAMES } from '~/lib/review/option-words';
import { BRIEF_STATE_LOOK, lookOf } from '~/components/ui/state-look';
import { StateBadge } from '../ui/StateBadge';
import { PAGE_SIZES, viewToParams, type DeskSortKey, type DeskView } from './desk-query';

type Page = DeskPage;
type Row = Page['items'][number];

/** The current design's figures, only where it can be built: a blocked design has no efficiency or cost to compare. */
const buildable = (row: Row) => (row.summary?.feasible ? row.summary : null);

/** What the brief's figures are of: the quoted or newest revision's chosen option, else the engine's pick at submission. */
function DesignCell({ row }: { row: Row }) {
  const s = row.summary;
  if (!s) return <span className="text-ink-faint">{row.state === 'draft' ? 'Not yet ranked' : '—'}</span>;
  const source = row.design ? `Rev. ${row.design.revision}${row.design.quoted ? ', quoted' : ''}` : 'At submission';
  return (
    <div className="max-w-72" data-design={s.feasible ? 'feasible' : 'blocked'}>
      {s.feasible ? (
        TOPOLOGY_NAMES[s.topology]
      ) : (
        <span className="font-semibold text-stop-700">
          <span aria-hidden="true">✕ </span>
          {s.feasibleCount === 0 ? 'No design meets the brief' : `${TOPOLOGY_NAMES[s.topology]} cannot be built`}
        </span>
      )}
      {!s.feasible && s.reason && <p className="text-xs text-ink-soft">{s.reason}</p>}
      <p className="text-xs text-ink-faint">
        {source} · {s.feasibleCount} feasible
      </p>
    </div>
  );
}

interface Props {
  initial: Page;
  initialView: DeskView;
  clients: { id: string; name: string; company: string | null }[];
  currency: string;
}

const SEARCH_DELAY_MS = 300;
const column = createColumnHelper<Row>();
/** Figures read right-aligned, like a column of sums. */
const NUMERIC = new Set(['efficiency', 'heat', 'parts', 'cost']);
const controlClass = 'rounded-md border border-ink/25 bg-card px-3 py-2 text-sm';

/** Every brief in a server-paged, server-sorted table; the URL keeps the view so a reload or a link returns to it. */
export default function DeskTable({ initial, initialView, clients, currency }: Props) {
  const [view, setView] = useState<DeskView>(initialView);
  const [search, setSearch] = useState(initialView.q);
  const [data, setData] = useState<Page>(initial);
  const [loading, setLoading] = useState(false);
  const [failure, setFailure] = useState<string | null>(null);
  const first = useRef(true);

  useEffect(() => {
    const timer = setTimeout(() => setView((v) => (v.q === search ? v : { ...v, q: search, page: 1 })), SEARCH_DELAY_MS);
    return () => clearTimeout(timer);
  }, [search]);

  useEffect(() => {
    // The server rendered the first page already.
    if (first.current) {
      first.current = false;
      return;
    }
    const params = viewToParams(view);
    window.history.replaceState(null, '', `/desk?${params}`);
    const controller = new AbortController();
    setLoading(true);
    fetch(`/api/v1/briefs?${params}`, { signal: controller.signal })
      .then(async (response) => {
        if (!response.ok) throw new Error(String(response.status));
        setData((await response.json()) as Page);
        setFailure(null);
      })
      .catch((error: Error) => {
        if (error.name !== 'AbortError') setFailure('The list could not be loaded. Check the connection and change a filter to try again.');
      })
      .finally(() => {
        if (!controller.signal.aborted) setLoading(false);
      });
    return () => controller.abort();
  }, [view]);

  const columns = useMemo(
    () => [
      column.accessor((r) => r.client.company ?? r.client.name, {
        id: 'client',
        header: 'Client',
        enableSorting: false,
        cell: (c) => (
          <>
            <span className="font-semibold">{c.row.original.client.company ?? '—'}</span>
            <br />
            <span className="text-ink-faint">{c.row.original.client.name}</span>
          </>
        ),
      }),
      column.accessor('title', {
        header: 'Title',
        cell: (c) => (
          <div className="min-w-52">
            <a href={`/desk/briefs/${c.row.original.id}`} className="font-semibold">
              {c.getValue()}
            </a>
            {(c.row.original.highestV ?? 0) > ES1_DC_LIMIT_V && (
              <span className="mt-1 flex w-fit items-center gap-1 whitespace-nowrap rounded border border-stop-700/30 bg-stop-50 px-1.5 text-xs font-bold text-stop-700">
                <span aria-hidden="true">⚡</span>Hazardous voltage: {formatSi(c.row.original.highestV!, 'V')}
              </span>
            )}
          </div>
        ),
      }),
      column.accessor('state', {
        header: 'State',
        enableSorting: false,
        cell: (c) => <StateBadge table={BRIEF_STATE_LOOK} state={c.getValue()} />,
      }),
      column.accessor('submittedAt', {
        id: 'submitted',
        header: 'Submitted',
        cell: (c) => <span className="whitespace-nowrap">{formatDate(c.getValue() ? Date.parse(c.getValue()!) : null)}</span>,
      }),
      column.accessor('updatedAt', {
        id: 'updated',
        header: 'Last change',
        cell: (c) => <span className="whitespace-nowrap">{formatDate(Date.parse(c.getValue()))}</span>,
      }),
      column.display({
        id: 'design',
        header: 'Current design',
        cell: (c) => <DesignCell row={c.row.original} />,
      }),
      column.accessor((r) => buildable(r)?.efficiencyNominal ?? null, {
        id: 'efficiency',
        header: 'Efficiency',
        enableSorting: false,
        cell: (c) => (c.getValue() === null ? '—' : percent(c.getValue()!)),
      }),
      column.accessor((r) => buildable(r)?.dissipationMaxW ?? null, {
        id: 'heat',
        header: 'Worst heat',
        enableSorting: false,
        cell: (c) => (c.getValue() === null ? '—' : formatSi(c.getValue()!, 'W')),
      }),
      column.accessor((r) => buildable(r)?.partCount ?? null, {
        id: 'parts',
        header: 'Parts',
        enableSorting: false,
        cell: (c) => c.getValue() ?? '—',
      }),
      column.accessor((r) => buildable(r)?.costCents ?? null, {
        id: 'cost',
        header: 'Parts cost',
        enableSorting: false,
        cell: (c) => (c.getValue() === null ? '—' : formatMoney(c.getValue()!, currency)),
      }),
    ],
    [currency],
  );

  const sorting: SortingState = [{ id: view.sort, desc: view.desc }];
  const pageCount = Math.max(1, Math.ceil(data.total / view.pageSize));
  const table = useReactTable({
    data: data.items,
    columns,
    getCoreRowModel: getCoreRowModel(),
    manualSorting: true,
    manualPagination: true,
    enableSortingRemoval: false,
    pageCount,
    state: { sorting, pagination: { pageIndex: view.page - 1, pageSize: view.pageSize } },
    onSortingChange: (updater) => {
      const next = (typeof updater === 'function' ? updater(sorting) : updater)[0];
      if (next) setView((v) => ({ ...v, sort: next.id as DeskSortKey, desc: next.desc, page: 1 }));
    },
  });

  const shownFrom = data.total === 0 ? 0 : (data.page - 1) * data.pageSize + 1;
  const shownTo = Math.min(data.total, data.page * data.pageSize);

  return (
    <div>
      <div className="flex flex-wrap items-end gap-3" role="search" aria-label="Filter briefs">
        <div className="flex flex-col gap-1">
          <label htmlFor="desk-q" className="text-sm font-semibold">
            Search
          </label>
          <input
            id="desk-q"
            type="search"
            value={search}
            onChange={(e) => setSearch(e.target.value)}
            placeholder="Title, client or company"
            className={controlClass}
          />
        </div>
        <div className="flex flex-col gap-1">
          <label htmlFor="desk-state" className="text-sm font-semibold">
            State
          </label>
          <select
            id="desk-state"
            value={view.state}
            onChange={(e) => setView((v) => ({ ...v, state: e.target.value, page: 1 }))}
            className={controlClass}
          >
            <option value="">All states</option>
            {BRIEF_STATES.map((s) => (
              <option key={s} value={s}>
                {lookOf(BRIEF_STATE_LOOK, s).label}
              </option>
            ))}
          </select>
        </div>
        <div className="flex flex-col gap-1">
          <label htmlFor="desk-client" className="text-sm font-semibold">
            Client
          </label>
          <select
            id="desk-client"
            value={view.client}
            onChange={(e) => setView((v) => ({ ...v, client: e.target.value, page: 1 }))}
            className={controlClass}
          >
            <option value="">All clients</option>
            {clients.map((c) => (
              <option key={c.id} value={c.id}>
                {c.company ? `${c.company} — ${c.name}` : c.name}
              </option>
            ))}
          </select>
        </div>
        <p className="ml-auto text-sm text-ink-soft" aria-live="polite">
          {loading ? (
            'Loading…'
          ) : failure ? (
            <span className="text-stop-700">{failure}</span>
          ) : (
            `${shownFrom}–${shownTo} of ${data.total} brief${data.total === 1 ? '' : 's'}`
          )}
        </p>
      </div>

      <div className="mt-4 overflow-x-auto rounded-lg border border-rule bg-card" aria-busy={loading}>
        <table className="notebook">
          <caption className="sr-only">Briefs; column headers with a button sort the list</caption>
          <thead>
            {table.getHeaderGroups().map((group) => (
              <tr key={group.id}>
                {group.headers.map((header) => {
                  const sorted = header.column.getIsSorted();
                  const label = flexRender(header.column.columnDef.header, header.getContext());
                  return (
                    <th
                      key={header.id}
                      scope="col"
                      className={NUMERIC.has(header.column.id) ? 'num' : undefined}
                      aria-sort={sorted ? (sorted === 'desc' ? 'descending' : 'ascending') : undefined}
                    >
                      {header.column.getCanSort() ? (
                        <button
                          type="button"
                          onClick={header.column.getToggleSortingHandler()}
                          className="inline-flex items-center gap-1 font-bold hover:text-copper-700"
                        >
                          {label}
                          <span aria-hidden="true">{sorted === 'desc' ? '▼' : sorted === 'asc' ? '▲' : '↕'}</span>
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
            {table.getRowModel().rows.map((row) => (
              <tr key={row.id} data-brief={row.original.id}>
                {row.getVisibleCells().map((cell) => (
                  <td key={cell.id} className={NUMERIC.has(cell.column.id) ? 'num' : undefined}>
                    {flexRender(cell.column.columnDef.cell, cell.getContext())}
                  </td>
                ))}
              </tr>
            ))}
            {data.items.length === 0 && (
              <tr>
                <td colSpan={columns.length} className="py-8 text-center text-ink-soft">
                  No briefs match. Clear the search or choose another state or client.
                </td>
              </tr>
            )}
          </tbody>
        </table>
      </div>

      <nav aria-label="Pages" className="mt-4 flex flex-wrap items-center gap-3 text-sm">
        <button
          type="button"
          className={controlClass}
          onClick={() => setView((v) => ({ ...v, page: v.page - 1 }))}
          disabled={view.page <= 1 || loading}
        >
          ← Previous
        </button>
        <span>
          Page {view.page} of {pageCount}
        </span>
        <button
          type="button"
          className={controlClass}
          onClick={() => setView((v) => ({ ...v, page: v.page + 1 }))}
          disabled={view.page >= pageCount || loading}
        >
          Next →
        </button>
        <label htmlFor="desk-size" className="ml-4">
          Rows per page
        </label>
        <select
          id="desk-size"
          value={view.pageSize}
          onChange={(e) => setView((v) => ({ ...v, pageSize: Number(e.target.value), page: 1 }))}
          className={controlClass}
        >
          {PAGE_SIZES.map((n) => (
            <option key={n} value={n}>
              {n}
            </option>
          ))}
        </select>
      </nav>
    </div>
  );
}
