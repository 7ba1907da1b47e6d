'use client';

import { useId, useMemo, useState } from 'react';
import Link from 'next/link';
import {
  createColumnHelper, flexRender, getCoreRowModel, getFilteredRowModel, getSortedRowModel, useReactTable,
  type ColumnFiltersState, type FilterFn, type SortingState,
} from '@tanstack/react-table';
import { sizeText, otherUnit, type LengthUnit } from '@/lib/measurements/units';
import type { MeasurementView, ProjectMeasurements } from '@/lib/types/measurements';
import { inputClass } from '@/components/ui/field';
import { KindBadge, VerdictBadge } from './badges';

type Props = { initial: ProjectMeasurements; unit: LengthUnit };

type VerdictFilter = 'all' | 'inside' | 'outside' | 'none';

const column = createColumnHelper<MeasurementView>();
// Outside first when sorting by verdict: what needs attention comes to the top.
const VERDICT_RANK: Record<MeasurementView['verdict']['state'], number> = { over: 0, under: 0, none: 1, inside: 2 };

const verdictFilter: FilterFn<MeasurementView> = (row, _id, value: VerdictFilter) => {
  const s = row.original.verdict.state;
  if (value === 'all') return true;
  if (value === 'outside') return s === 'over' || s === 'under';
  return s === value;
};

const searchText = (r: MeasurementView) =>
  `${r.feature} ${r.entry.title} ${r.entry.sessionTitle} ${r.limits.label} ${r.nominalText} ${r.unit} ${r.kind === 'outside' ? 'shaft-like outside' : 'hole-like inside'}`.toLowerCase();

function SortMark({ dir }: { dir: false | 'asc' | 'desc' }) {
  return (
    <span aria-hidden="true" className="ml-1 inline-block w-3 text-dye">
      {dir === 'asc' ? '▲' : dir === 'desc' ? '▼' : '↕'}
    </span>
  );
}

/** Every record of the project: sortable, filterable, downloadable as CSV. */
export function ProjectRecordsTable({ initial, unit }: Props) {
  const id = useId();
  const slug = initial.project.slug;
  // Rendered on the server with the page and not fetched again here (sorting and filtering are local).
  const data = initial;
  const [sorting, setSorting] = useState<SortingState>([]);
  const [text, setText] = useState('');
  const [verdict, setVerdict] = useState<VerdictFilter>('all');
  const other = otherUnit(unit);
  const fitOf = useMemo(() => {
    const m = new Map<number, string>();
    for (const p of data.pairs) {
      const words = p.analysis.actualState === 'within' ? '✓ within' : p.analysis.actualState === 'unknown' ? 'not measured' : '✕ out of range';
      const label = `${p.analysis.fit ?? 'fit'} · ${words}`;
      m.set(p.hole.id, label);
      m.set(p.shaft.id, label);
    }
    return m;
  }, [data.pairs]);

  const columns = useMemo(
    () => [
      column.accessor('feature', {
        header: 'Feature',
        cell: (c) => (
          <span className="flex flex-col gap-0.5">
            <Link href={`/logs/${slug}/records/${c.row.original.id}${unit !== data.project.units ? `?unit=${unit}` : ''}`} className="font-semibold">
              {c.getValue()}
            </Link>
            <span className="dim text-xs md:hidden">
              {c.row.original.nominalText} {c.row.original.unit} {c.row.original.limits.label}
            </span>
            <KindBadge kind={c.row.original.kind} />
          </span>
        ),
      }),
      column.accessor((r) => r.entry.sessionPosition * 10_000 + r.entry.id, {
        id: 'entry',
        header: 'Entry',
        cell: (c) => (
          <Link href={`/logs/${slug}/entries/${c.row.original.entry.id}`} className="text-sm">
            <span className="block text-xs text-graphite-2">Session {c.row.original.entry.sessionPosition + 1}</span>
            {c.row.original.entry.title}
          </Link>
        ),
      }),
      column.accessor((r) => r.limits.nominalUm, {
        id: 'size',
        header: 'Size and specification',
        cell: (c) => (
          <span className="dim whitespace-nowrap">
            {c.row.original.nominalText} {c.row.original.unit} {c.row.original.limits.label}
          </span>
        ),
      }),
      column.display({
        id: 'limits',
        header: 'Limits',
        cell: (c) => {
          const l = c.row.original.limits;
          const t = (u: LengthUnit) => `${sizeText(l.nominalUm + l.lowerUm, u)} – ${sizeText(l.nominalUm + l.upperUm, u)} ${u}`;
          return (
            <span className="dim whitespace-nowrap">
              <span className="block">{t(unit)}</span>
              <span className="block text-xs text-graphite-2">{t(other)}</span>
            </span>
          );
        },
      }),
      column.accessor((r) => r.readings[r.readings.length - 1]?.judgement.deviationUm ?? Number.NEGATIVE_INFINITY, {
        id: 'latest',
        header: 'Latest reading',
        cell: (c) => {
          const r = c.row.original.readings[c.row.original.readings.length - 1];
          if (!r) return <span className="text-graphite-2">—</span>;
          return (
            <span className="dim whitespace-nowrap">
              <span className="block">
                {sizeText(r.judgement.sizeUm, unit)} {unit}
              </span>
              <span className="block text-xs text-graphite-2">
                {c.row.original.readings.length} {c.row.original.readings.length === 1 ? 'reading' : 'readings'}
              </span>
            </span>
          );
        },
      }),
      column.accessor((r) => VERDICT_RANK[r.verdict.state], {
        id: 'verdict',
        header: 'Verdict',
        filterFn: verdictFilter,
        cell: (c) => <VerdictBadge state={c.row.original.verdict.state} outsideByUm={c.row.original.verdict.outsideByUm} unit={unit} />,
      }),
      column.display({
        id: 'fit',
        header: 'Fit',
        cell: (c) => <span className="whitespace-nowrap text-xs">{fitOf.get(c.row.original.id) ?? '—'}</span>,
      }),
    ],
    [slug, unit, other, data.project.units, fitOf],
  );

  // Stable between renders: a fresh array each time makes the table recompute and reset itself in a loop.
  const columnFilters = useMemo<ColumnFiltersState>(() => (verdict === 'all' ? [] : [{ id: 'verdict', value: verdict }]), [verdict]);
  const table = useReactTable({
    data: data.records,
    columns,
    state: { sorting, globalFilter: text, columnFilters },
    onSortingChange: setSorting,
    autoResetPageIndex: false,
    globalFilterFn: (row, _id, value: string) => searchText(row.original).includes(value.trim().toLowerCase()),
    getCoreRowModel: getCoreRowModel(),
    getSortedRowModel: getSortedRowModel(),
    getFilteredRowModel: getFilteredRowModel(),
  });
  const rows = table.getRowModel().rows;
  const counts = data.records.reduce(
    (c, r) => {
      const s = r.verdict.state;
      if (s === 'inside') c.inside++;
      else if (s === 'none') c.none++;
      else c.outside++;
      return c;
    },
    { inside: 0, outside: 0, none: 0 },
  );
  const sortable = new Set(['feature', 'entry', 'size', 'latest', 'verdict']);
  // On a phone the size rides under the feature name, so the verdict stays on screen.
  const hideOnPhone = new Set(['entry', 'size', 'limits', 'fit']);

  return (
    <div className="space-y-4">
      <p className="text-sm" data-testid="records-summary">
        {data.records.length} {data.records.length === 1 ? 'record' : 'records'}:{' '}
        <span className="text-ok">
          <span aria-hidden="true">✓</span> {counts.inside} inside
        </span>
        ,{' '}
        <span className={counts.outside ? 'font-semibold text-bad' : ''}>
          <span aria-hidden="true">✕</span> {counts.outside} outside
        </span>
        {counts.none ? `, ${counts.none} without readings` : ''}, judged by each record&apos;s latest reading.
      </p>

      <div className="flex flex-wrap items-end gap-3">
        <div className="flex min-w-56 flex-1 flex-col gap-1">
          <label htmlFor={`${id}-filter`} className="text-sm font-semibold">
            Filter
          </label>
          <input
            id={`${id}-filter`}
            type="search"
            value={text}
            onChange={(e) => setText(e.target.value)}
            placeholder="Feature, entry, zone…"
            className={inputClass}
          />
        </div>
        <div className="flex flex-col gap-1">
          <label htmlFor={`${id}-verdict`} className="text-sm font-semibold">
            Verdict
          </label>
          <select id={`${id}-verdict`} value={verdict} onChange={(e) => setVerdict(e.target.value as VerdictFilter)} className={inputClass}>
            <option value="all">All</option>
            <option value="inside">Inside</option>
            <option value="outside">Outside</option>
            <option value="none">No readings</option>
          </select>
        </div>
        <a
          href={`/api/projects/${initial.project.id}/measurements?format=csv`}
          download
          className="inline-flex min-h-11 items-center gap-2 rounded-md border border-rule bg-card px-4 text-sm font-semibold no-underline hover:bg-paper-2"
        >
          <span aria-hidden="true">↓</span> Download CSV
        </a>
      </div>
      <p className="text-xs text-graphite-2">The CSV has one row per reading, with limits and readings in both millimetres and inches.</p>

      <div className="overflow-x-auto rounded-lg border border-rule bg-card">
        <table className="w-full text-sm" data-testid="project-measurements">
          <caption className="sr-only">All measurement records of {data.project.title}; column headers sort the table</caption>
          <thead>
            {table.getHeaderGroups().map((g) => (
              <tr key={g.id} className="border-b border-rule text-left text-xs text-graphite-2">
                {g.headers.map((h) => {
                  const dir = h.column.getIsSorted();
                  const phone = hideOnPhone.has(h.column.id) ? 'hidden md:table-cell' : '';
                  return (
                    <th
                      key={h.id}
                      scope="col"
                      className={`px-3 py-1 font-semibold ${phone}`}
                      aria-sort={dir === 'asc' ? 'ascending' : dir === 'desc' ? 'descending' : sortable.has(h.column.id) ? 'none' : undefined}
                    >
                      {sortable.has(h.column.id) ? (
                        <button type="button" onClick={h.column.getToggleSortingHandler()} className="inline-flex min-h-11 items-center font-semibold">
                          {flexRender(h.column.columnDef.header, h.getContext())}
                          <SortMark dir={dir} />
                        </button>
                      ) : (
                        flexRender(h.column.columnDef.header, h.getContext())
                      )}
                    </th>
                  );
                })}
              </tr>
            ))}
          </thead>
          <tbody>
            {rows.map((row) => (
              <tr key={row.id} className="border-b border-rule/60 align-top last:border-0" data-record={row.original.feature}>
                {row.getVisibleCells().map((cell) => (
                  <td key={cell.id} className={`px-3 py-2 ${hideOnPhone.has(cell.column.id) ? 'hidden md:table-cell' : ''}`}>
                    {flexRender(cell.column.columnDef.cell, cell.getContext())}
                  </td>
                ))}
              </tr>
            ))}
            {!rows.length ? (
              <tr>
                <td colSpan={columns.length} className="px-3 py-6 text-center text-graphite-2">
                  {data.records.length ? 'No record matches the filter.' : 'No measurements have been recorded in this project yet.'}
                </td>
              </tr>
            ) : null}
          </tbody>
        </table>
      </div>
    </div>
  );
}
