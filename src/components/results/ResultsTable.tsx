import { useMemo, useState } from "react";
import {
  createColumnHelper,
  flexRender,
  getCoreRowModel,
  getFilteredRowModel,
  getSortedRowModel,
  useReactTable,
  type ColumnFiltersState,
  type SortingState,
} from "@tanstack/react-table";
import type { ResultsResponse, OptionResult } from "@/lib/contracts/results";
import { overallStatus } from "@/lib/calc/requirement-flags";
import FlagChips from "./FlagChips";
import { fraction, oneDecimal, whole } from "./format";
import { lightSortKey, lightText, makeupLight } from "@/lib/calc/makeup-light";

export interface ResultRow extends OptionResult {
  facadeId: string;
  facadeName: string;
  azimuthDeg: number;
  overall: ReturnType<typeof overallStatus>;
}

export const rowsOf = (r: ResultsResponse): ResultRow[] =>
  r.facades.flatMap((f) =>
    f.options.map((o) => ({ ...o, facadeId: f.facadeId, facadeName: f.name, azimuthDeg: f.azimuthDeg, overall: overallStatus(o.flags) })),
  );

const col = createColumnHelper<ResultRow>();
const STATUS_LABEL = { proposed: "proposed", approved: "approved", rejected: "rejected" } as const;
const OVERALL_LABEL = { pass: "all pass", fail: "fails a limit", unknown: "some unknown", none: "no limits" } as const;

interface Props {
  results: ResultsResponse;
  selected: string[];
  onToggle: (optionId: string) => void;
  timeZone: string;
}

/** Façades × options: values, yearly figures and flags; sortable by any column, filtered by façade, status and flag. */
export default function ResultsTable({ results, selected, onToggle, timeZone }: Props) {
  const data = useMemo(() => rowsOf(results), [results]);
  const [sorting, setSorting] = useState<SortingState>([]);
  const [filters, setFilters] = useState<ColumnFiltersState>([]);
  const peakTime = (at: string | null) =>
    at ? new Date(at).toLocaleString("en-GB", { timeZone, month: "short", day: "numeric", hour: "2-digit", minute: "2-digit" }) : "—";
  const columns = useMemo(
    () => [
      col.display({
        id: "select",
        header: () => <span className="sr-only">Compare</span>,
        cell: (c) => (
          <input
            type="checkbox"
            aria-label={`Compare ${c.row.original.facadeName} · ${c.row.original.name}`}
            checked={selected.includes(c.row.original.optionId)}
            onChange={() => onToggle(c.row.original.optionId)}
            disabled={Boolean(c.row.original.problem)}
          />
        ),
      }),
      col.accessor("facadeName", { header: "Façade", filterFn: "equals", cell: (c) => <span className="block min-w-[7rem]">{c.getValue()}</span> }),
      col.accessor("name", {
        header: "Option",
        cell: (c) => (
          <div className="min-w-[11rem]">
            <div className="font-bold">{c.getValue()}</div>
            <div className="text-xs text-slate">
              {c.row.original.makeupName} r{c.row.original.makeupRevision} · {c.row.original.description}
            </div>
            {c.row.original.problem && <div className="text-xs text-alert">{c.row.original.problem}</div>}
          </div>
        ),
      }),
      col.accessor("status", { header: "Status", filterFn: "equals", cell: (c) => <span className="badge">{STATUS_LABEL[c.getValue()]}</span> }),
      col.accessor((r) => r.values.normal.solarTransmittance, { id: "tau", header: "τe", cell: (c) => fraction(c.getValue()) }),
      col.accessor((r) => r.values.normal.solarReflectanceFront, { id: "rhoOut", header: "ρe out", cell: (c) => fraction(c.getValue()) }),
      col.accessor((r) => r.values.normal.solarReflectanceBack, { id: "rhoIn", header: "ρe in", cell: (c) => fraction(c.getValue()) }),
      col.accessor((r) => r.values.normal.layerAbsorptance.reduce((a, b) => a + b, 0), {
        id: "alpha",
        header: "α per pane",
        cell: (c) => <span className="whitespace-nowrap">{c.row.original.values.normal.layerAbsorptance.map((a) => a.toFixed(3)).join(" / ")}</span>,
      }),
      col.accessor((r) => r.values.normal.gValue, { id: "g", header: "g", cell: (c) => fraction(c.getValue()) }),
      col.accessor((r) => r.values.uValue, { id: "u", header: "U W/m²K", cell: (c) => c.getValue().toFixed(2) }),
      col.accessor((r) => lightSortKey(makeupLight(r.values)), {
        id: "tauV",
        header: "τv",
        cell: (c) => {
          const light = makeupLight(c.row.original.values);
          const title =
            light.basis === "not given"
              ? "needs each pane's light transmittance"
              : light.transmittance === null
                ? "range: some light reflectances unknown"
                : undefined;
          return <span title={title}>{lightText(light, 3)}</span>;
        },
      }),
      col.accessor((r) => r.values.hemispherical.solarTransmittance, { id: "tauHem", header: "τe hemisph.", cell: (c) => fraction(c.getValue()) }),
      col.accessor((r) => r.annual.transmittedKWhm2, { id: "annualT", header: "Transmitted kWh/m²·a", cell: (c) => whole(c.getValue()) }),
      col.accessor((r) => r.annual.solarGainKWhm2, { id: "annualG", header: "Solar gain kWh/m²·a", cell: (c) => whole(c.getValue()) }),
      col.accessor((r) => r.peak.transmittedWm2, {
        id: "peak",
        header: "Peak transmitted W/m²",
        cell: (c) => (
          <span className="whitespace-nowrap">
            {oneDecimal(c.getValue())}
            <span className="block text-xs text-slate">{peakTime(c.row.original.peak.at)}</span>
          </span>
        ),
      }),
      col.accessor("overall", {
        header: "Requirements",
        filterFn: "equals",
        sortingFn: (a, b) => ORDER[a.original.overall] - ORDER[b.original.overall],
        cell: (c) => <FlagChips flags={c.row.original.flags} />,
      }),
    ],
    // eslint-disable-next-line react-hooks/exhaustive-deps
    [selected, timeZone],
  );
  // TanStack Table returns fresh functions on purpose; this component is not memoised by the compiler.
  // eslint-disable-next-line react-hooks/incompatible-library
  const table = useReactTable({
    data,
    columns,
    state: { sorting, columnFilters: filters },
    onSortingChange: setSorting,
    onColumnFiltersChange: setFilters,
    getCoreRowModel: getCoreRowModel(),
    getSortedRowModel: getSortedRowModel(),
    getFilteredRowModel: getFilteredRowModel(),
    getRowId: (r) => r.optionId,
  });
  const facadeNames = [...new Set(data.map((r) => r.facadeName))];
  const filterOf = (id: string) => (filters.find((f) => f.id === id)?.value as string | undefined) ?? "";
  const setFilter = (id: string, value: string) => table.getColumn(id)!.setFilterValue(value || undefined);
  const shown = table.getRowModel().rows;

  return (
    <div className="space-y-3">
      <div className="flex flex-wrap gap-3 text-sm">
        <div className="flex flex-col">
          <label htmlFor="filter-facadeName" className="font-bold text-slate">
            Façade
          </label>
          <select
            id="filter-facadeName"
            className="rounded border border-line px-2 py-1"
            value={filterOf("facadeName")}
            onChange={(e) => setFilter("facadeName", e.target.value)}
          >
            <option value="">all façades</option>
            {facadeNames.map((n) => (
              <option key={n} value={n}>
                {n}
              </option>
            ))}
          </select>
        </div>
        <div className="flex flex-col">
          <label htmlFor="filter-status" className="font-bold text-slate">
            Status
          </label>
          <select
            id="filter-status"
            className="rounded border border-line px-2 py-1"
            value={filterOf("status")}
            onChange={(e) => setFilter("status", e.target.value)}
          >
            <option value="">any status</option>
            {Object.entries(STATUS_LABEL).map(([k, v]) => (
              <option key={k} value={k}>
                {v}
              </option>
            ))}
          </select>
        </div>
        <div className="flex flex-col">
          <label htmlFor="filter-overall" className="font-bold text-slate">
            Requirements
          </label>
          <select
            id="filter-overall"
            className="rounded border border-line px-2 py-1"
            value={filterOf("overall")}
            onChange={(e) => setFilter("overall", e.target.value)}
          >
            <option value="">any result</option>
            {Object.entries(OVERALL_LABEL).map(([k, v]) => (
              <option key={k} value={k}>
                {v}
              </option>
            ))}
          </select>
        </div>
        <p className="self-end text-slate" aria-live="polite">
          {shown.length} of {data.length} options
        </p>
      </div>
      <div className="overflow-x-auto rounded border border-line" data-testid="results-table-scroll">
        <table className="w-full border-collapse text-sm" data-testid="results-table">
          <thead className="bg-paper text-left text-slate">
            {table.getHeaderGroups().map((hg) => (
              <tr key={hg.id}>
                {hg.headers.map((h) => {
                  const sort = h.column.getIsSorted();
                  return (
                    <th
                      key={h.id}
                      className="border-b border-line px-2 py-1.5 align-bottom"
                      aria-sort={sort === "asc" ? "ascending" : sort === "desc" ? "descending" : undefined}
                    >
                      {h.column.getCanSort() ? (
                        <button type="button" className="text-left font-bold hover:text-ink" onClick={h.column.getToggleSortingHandler()}>
                          {flexRender(h.column.columnDef.header, h.getContext())}
                          <span aria-hidden="true">{sort === "asc" ? " ▲" : sort === "desc" ? " ▼" : ""}</span>
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
            {shown.length === 0 ? (
              <tr>
                <td colSpan={columns.length} className="px-2 py-4 text-center text-slate">
                  No option matches these filters.
                </td>
              </tr>
            ) : (
              shown.map((row) => (
                <tr key={row.id} className="border-t border-line align-top" data-option={row.original.optionId}>
                  {row.getVisibleCells().map((cell) => (
                    <td key={cell.id} className="px-2 py-1.5 tabular-nums" data-col={cell.column.id}>
                      {flexRender(cell.column.columnDef.cell, cell.getContext())}
                    </td>
                  ))}
                </tr>
              ))
            )}
          </tbody>
        </table>
      </div>
    </div>
  );
}

const ORDER = { fail: 0, unknown: 1, pass: 2, none: 3 } as const;
