import { useMemo, useState } from "react";
import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import {
  createColumnHelper,
  flexRender,
  getCoreRowModel,
  getFilteredRowModel,
  getSortedRowModel,
  useReactTable,
  type SortingState,
} from "@tanstack/react-table";
import { api, ApiError } from "@/lib/client/api";
import { withQueryClient } from "@/lib/client/query";
import type { MakeupEntry } from "@/lib/contracts/library";
import { writeComposerDraft } from "@/components/glazing/draft";
import { lightSortKey, lightText, makeupLight } from "@/lib/calc/makeup-light";

interface Props {
  organizationId: string;
  initial: MakeupEntry[];
  canEdit: boolean;
  canDelete: boolean;
}

const col = createColumnHelper<MakeupEntry>();
/** τv as the table shows it: the value, a range (light reflectance unknown) or "—". */
const lightCell = (light: ReturnType<typeof makeupLight>) =>
  light.basis === "not given" ? (
    "—"
  ) : (
    <span title={light.transmittance === null ? "range: some light reflectances unknown" : undefined}>{lightText(light)}</span>
  );
const fixed = (v: number | null | undefined, d = 2) => (v === null || v === undefined ? "—" : v.toFixed(d));

/** The organisation's saved make-ups: sortable, searchable, opened in the composer or deleted. */
function LibraryTable({ organizationId, initial, canEdit, canDelete }: Props) {
  const qc = useQueryClient();
  const q = useQuery({
    queryKey: ["makeups", organizationId],
    queryFn: () => api<{ items: MakeupEntry[] }>("GET", `/api/v1/orgs/${organizationId}/makeups?limit=100`),
    initialData: { items: initial },
  });
  const [sorting, setSorting] = useState<SortingState>([{ id: "name", desc: false }]);
  const [filter, setFilter] = useState("");
  const [message, setMessage] = useState<string | null>(null);
  const remove = useMutation({
    mutationFn: (m: MakeupEntry) => api("DELETE", `/api/v1/makeups/${m.id}`),
    onSuccess: () => {
      setMessage(null);
      void qc.invalidateQueries({ queryKey: ["makeups", organizationId] });
    },
    onError: (err) => setMessage(err instanceof ApiError ? err.message : "The make-up could not be deleted."),
  });
  const { mutate: removeMakeup, isPending: removing } = remove;
  const columns = useMemo(() => {
    const openInComposer = (m: MakeupEntry) => {
      writeComposerDraft({ layers: m.layers, open: { id: m.id, revision: m.revision, name: m.name } });
      window.location.href = "/glazing";
    };
    return [
      col.accessor("name", { header: "Name", cell: (c) => <strong>{c.getValue()}</strong> }),
      col.accessor("description", { header: "Make-up", cell: (c) => <span className="font-mono text-xs">{c.getValue()}</span> }),
      col.accessor((m) => m.values.normal.solarTransmittance, { id: "te", header: "τe", cell: (c) => fixed(c.getValue()) }),
      col.accessor((m) => m.values.normal.gValue, { id: "g", header: "g", cell: (c) => fixed(c.getValue()) }),
      col.accessor((m) => m.values.uValue, { id: "u", header: "U W/m²K", cell: (c) => fixed(c.getValue()) }),
      col.accessor((m) => lightSortKey(makeupLight(m.values)), {
        id: "tv",
        header: "τv",
        cell: (c) => lightCell(makeupLight(c.row.original.values)),
      }),
      col.accessor("revision", { header: "Rev.", cell: (c) => c.getValue() }),
      col.accessor("updatedAt", {
        header: "Saved",
        cell: (c) => new Date(c.getValue()).toLocaleDateString("en-GB", { day: "numeric", month: "short", year: "numeric" }),
      }),
      col.display({
        id: "actions",
        header: () => <span className="sr-only">Actions</span>,
        cell: (c) => (
          <div className="flex justify-end gap-2">
            <button type="button" className="btn-quiet text-xs" onClick={() => openInComposer(c.row.original)}>
              {canEdit ? "Open to edit" : "Open"}
            </button>
            {canDelete && (
              <button
                type="button"
                className="btn-quiet text-xs"
                disabled={removing}
                onClick={() => {
                  if (window.confirm(`Delete “${c.row.original.name}” and all its revisions from the library?`)) removeMakeup(c.row.original);
                }}
              >
                Delete
              </button>
            )}
          </div>
        ),
      }),
    ];
  }, [canEdit, canDelete, removeMakeup, removing]);
  // eslint-disable-next-line react-hooks/incompatible-library -- TanStack Table returns fresh functions each render by design
  const table = useReactTable({
    data: q.data.items,
    columns,
    state: { sorting, globalFilter: filter },
    onSortingChange: setSorting,
    onGlobalFilterChange: setFilter,
    globalFilterFn: (row, _id, value: string) =>
      `${row.original.name} ${row.original.description} ${row.original.note ?? ""}`.toLowerCase().includes(value.toLowerCase()),
    getCoreRowModel: getCoreRowModel(),
    getSortedRowModel: getSortedRowModel(),
    getFilteredRowModel: getFilteredRowModel(),
  });

  return (
    <div className="space-y-3">
      <div className="flex flex-wrap items-end gap-3">
        <label className="flex min-w-[14rem] flex-col text-sm" htmlFor="library-filter">
          <span className="font-bold text-slate">Search name, make-up or note</span>
          <input id="library-filter" value={filter} onChange={(e) => setFilter(e.target.value)} />
        </label>
        <span className="text-sm text-slate">
          {table.getRowModel().rows.length} of {q.data.items.length} make-ups
        </span>
      </div>
      {message && (
        <p className="text-sm text-alert" role="alert">
          {message}
        </p>
      )}
      {q.data.items.length === 0 ? (
        <p className="text-sm text-slate">
          The library is empty. <a href="/glazing">Compose a make-up and save it to the library.</a>
        </p>
      ) : (
        <div className="relative overflow-x-auto">
          <table className="w-full min-w-[48rem] text-sm" data-testid="library-table">
            <thead className="text-left text-slate">
              {table.getHeaderGroups().map((hg) => (
                <tr key={hg.id}>
                  {hg.headers.map((h) => (
                    <th
                      key={h.id}
                      className="py-1 pr-3"
                      aria-sort={h.column.getIsSorted() === "asc" ? "ascending" : h.column.getIsSorted() === "desc" ? "descending" : undefined}
                    >
                      {h.column.getCanSort() ? (
                        <button type="button" className="font-bold" onClick={h.column.getToggleSortingHandler()}>
                          {flexRender(h.column.columnDef.header, h.getContext())}
                          {h.column.getIsSorted() === "asc" ? " ▲" : h.column.getIsSorted() === "desc" ? " ▼" : ""}
                        </button>
                      ) : (
                        flexRender(h.column.columnDef.header, h.getContext())
                      )}
                    </th>
                  ))}
                </tr>
              ))}
            </thead>
            <tbody>
              {table.getRowModel().rows.map((r) => (
                <tr key={r.id} className="border-t border-line" data-makeup={r.original.name}>
                  {r.getVisibleCells().map((c) => (
                    <td key={c.id} className="py-1.5 pr-3 tabular-nums">
                      {flexRender(c.column.columnDef.cell, c.getContext())}
                    </td>
                  ))}
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      )}
    </div>
  );
}

export default withQueryClient(LibraryTable);
