"use client";

import { useMemo } from "react";
import { useTable } from "@tanstack/react-table";
import type { LotItemView } from "@/lib/services/lots";
import { itemColumns, itemFeatures, type ColumnOptions, type ItemRow } from "./items-columns";

type TableChoices = { filter: string; setFilter: (f: string) => void; grouped: boolean };

/** The lot's items as a table: filtered by the text box, grouped by type family when asked, always expanded. */
export function useItemsTable(
  items: LotItemView[],
  options: ColumnOptions,
  { filter, setFilter, grouped }: TableChoices,
) {
  const { editable, onEdit, onRemove, onQuickChange } = options;
  const data = useMemo<ItemRow[]>(
    () => items.map((i) => ({ ...i, family: i.familyLabel, tested: i.readings.length })),
    [items],
  );
  const columns = useMemo(
    () => itemColumns({ editable, onEdit, onRemove, onQuickChange }),
    [editable, onEdit, onRemove, onQuickChange],
  );
  return useTable({
    features: itemFeatures,
    columns,
    data,
    getRowId: (r) => r.id,
    globalFilterFn: "includesString",
    state: { globalFilter: filter, grouping: grouped ? ["family"] : [], expanded: true },
    onGlobalFilterChange: (u) => setFilter(typeof u === "function" ? u(filter) : u),
  });
}

type ItemsTable = ReturnType<typeof useItemsTable>;
type GridRow = ReturnType<ItemsTable["getRowModel"]>["rows"][number];
type ViewProps = { table: ItemsTable; grouped: boolean; empty: boolean };

const leafCount = (rows: { subRows: unknown[] }[]): number =>
  rows.reduce((n, r) => n + (r.subRows.length ? leafCount(r.subRows as never) : 1), 0);
const tubes = (rows: { original: ItemRow; subRows: unknown[] }[]): number =>
  rows.reduce((n, r) => n + (r.subRows.length ? tubes(r.subRows as never) : r.original.quantity), 0);

/** A type family's heading with its count of lines and tubes. */
function FamilyTotals({ row, className }: { row: GridRow; className: string }) {
  return (
    <>
      {String(row.getGroupingValue("family"))}
      <span className={className}>
        {leafCount(row.subRows as never)} lines · {tubes(row.subRows as never)} tubes
      </span>
    </>
  );
}

/** On a phone: one card per line, each column a term and its value; family headings between them. */
export function ItemCards({ table, grouped, empty }: ViewProps) {
  return (
    <ul className="space-y-2" aria-label="Items" data-testid="items-cards">
      {table.getRowModel().rows.map((row) =>
        row.getIsGrouped() ? (
          <li key={row.id} className="pt-2 font-semibold">
            <FamilyTotals row={row} className="ml-2 text-sm font-normal text-flash-600" />
          </li>
        ) : (
          <li key={row.id} className="card p-3">
            <dl className="grid grid-cols-[auto_1fr] items-center gap-x-3 gap-y-1 text-sm">
              {row
                .getAllCells()
                .filter((c) => !(grouped && c.column.id === "family"))
                .map((c) => (
                  <div key={c.id} className="contents">
                    <dt className="text-xs text-flash-600">
                      {typeof c.column.columnDef.header === "string" ? c.column.columnDef.header : ""}
                    </dt>
                    <dd className="min-w-0">{c.getIsPlaceholder() ? null : <table.FlexRender cell={c} />}</dd>
                  </div>
                ))}
            </dl>
          </li>
        ),
      )}
      {empty ? <li className="text-flash-600">No items yet: add them by hand or import a CSV.</li> : null}
    </ul>
  );
}

/** The column headings; a sortable column's heading is a button that says its order. */
function ItemsHead({ table, grouped }: Omit<ViewProps, "empty">) {
  return (
    <thead className="bg-flash-100 text-left text-flash-700">
      {table.getHeaderGroups().map((g) => (
        <tr key={g.id}>
          {g.headers
            .filter((h) => !(grouped && h.column.id === "family"))
            .map((h) => {
              const sorted = h.column.getIsSorted();
              return (
                <th
                  key={h.id}
                  scope="col"
                  className="whitespace-nowrap px-2 py-2 font-medium"
                  aria-sort={sorted === "asc" ? "ascending" : sorted === "desc" ? "descending" : undefined}
                >
                  {h.column.getCanSort() && h.column.id !== "actions" ? (
                    <button
                      type="button"
                      onClick={h.column.getToggleSortingHandler()}
                      className="inline-flex items-center gap-1"
                    >
                      <table.FlexRender header={h} />
                      <span aria-hidden="true">{sorted === "asc" ? "▲" : sorted === "desc" ? "▼" : "↕"}</span>
                    </button>
                  ) : (
                    <table.FlexRender header={h} />
                  )}
                </th>
              );
            })}
        </tr>
      ))}
    </thead>
  );
}

/** On a wider screen: the table, with a heading row per type family. */
export function ItemsTableView({ table, grouped, empty }: ViewProps) {
  return (
    <div className="overflow-x-auto rounded-lg border border-flash-200 bg-white">
      <table className="min-w-full text-sm">
        <ItemsHead table={table} grouped={grouped} />
        <tbody>
          {table.getRowModel().rows.map((row) =>
            row.getIsGrouped() ? (
              <tr key={row.id} className="border-t border-flash-300 bg-flash-50">
                <th scope="rowgroup" colSpan={99} className="px-2 py-1.5 text-left font-semibold">
                  <FamilyTotals row={row} className="ml-2 font-normal text-flash-600" />
                </th>
              </tr>
            ) : (
              <tr key={row.id} className="border-t border-flash-200 align-top">
                {row
                  .getAllCells()
                  .filter((c) => !(grouped && c.column.id === "family"))
                  .map((c) => (
                    <td key={c.id} className="px-2 py-1.5">
                      {c.getIsPlaceholder() ? null : <table.FlexRender cell={c} />}
                    </td>
                  ))}
              </tr>
            ),
          )}
          {empty ? (
            <tr>
              <td colSpan={99} className="px-3 py-4 text-flash-600">
                No items yet: add them by hand or import a CSV.
              </td>
            </tr>
          ) : null}
        </tbody>
      </table>
    </div>
  );
}
