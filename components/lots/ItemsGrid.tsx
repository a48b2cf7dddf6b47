"use client";

import {
  columnFilteringFeature,
  columnGroupingFeature,
  createColumnHelper,
  createExpandedRowModel,
  createFilteredRowModel,
  createGroupedRowModel,
  createSortedRowModel,
  filterFn_includesString,
  globalFilteringFeature,
  rowExpandingFeature,
  rowSortingFeature,
  sortFn_alphanumeric,
  tableFeatures,
  useTable,
} from "@tanstack/react-table";
import { useMemo, useState } from "react";
import { useNarrow } from "@/components/useNarrow";
import type { ItemView, LotItemView } from "@/lib/services/lots";
import { CONDITION_VALUES } from "@/lib/validation/lots";
import { BASIS_WORDS, CONDITION_WORDS, HAZARD_WORDS } from "./words";

type Row = ItemView & { family: string; tested: number };

const features = tableFeatures({
  rowSortingFeature,
  sortedRowModel: createSortedRowModel(),
  sortFns: { alphanumeric: sortFn_alphanumeric },
  columnFilteringFeature,
  globalFilteringFeature,
  filteredRowModel: createFilteredRowModel(),
  filterFns: { includesString: filterFn_includesString },
  columnGroupingFeature,
  groupedRowModel: createGroupedRowModel(),
  rowExpandingFeature,
  expandedRowModel: createExpandedRowModel(),
});
const helper = createColumnHelper<typeof features, Row>();

type Props = {
  items: LotItemView[];
  editable: boolean;
  onEdit?: (item: ItemView) => void;
  onRemove?: (item: ItemView) => void;
  onQuickChange?: (item: ItemView, patch: Partial<Pick<ItemView, "quantity" | "condition" | "vacuumLoss">>) => void;
};

/**
 * The items of a lot: sortable, filterable, grouped by type family. In a
 * draft the quantity, condition and vacuum-loss cells are edited in place;
 * every control is a native input or button, so the grid works from the keyboard.
 */
export function ItemsGrid({ items, editable, onEdit, onRemove, onQuickChange }: Props) {
  const [filter, setFilter] = useState("");
  const [grouped, setGrouped] = useState(true);
  const narrow = useNarrow();
  const data = useMemo<Row[]>(
    () => items.map((i) => ({ ...i, family: i.familyLabel, tested: i.readings.length })),
    [items],
  );

  const columns = useMemo(
    () =>
      helper.columns([
        helper.accessor("family", { header: "Type family", sortFn: "alphanumeric" }),
        helper.accessor("designation", {
          header: "Designation",
          sortFn: "alphanumeric",
          cell: ({ row }) => (
            <span className="code">
              {row.original.designation}
              {!row.original.designationKnown ? (
                <span className="ml-1 rounded bg-glow-100 px-1 font-sans text-xs text-glow-700">check type</span>
              ) : null}
            </span>
          ),
        }),
        helper.accessor("quantity", {
          header: "Qty",
          cell: ({ row }) =>
            editable && onQuickChange ? (
              <input
                type="number"
                min={1}
                defaultValue={row.original.quantity}
                className="input w-20 py-1"
                aria-label={`Quantity of ${row.original.designation}, line ${row.original.position}`}
                onBlur={(e) => {
                  const q = Number(e.target.value);
                  if (q >= 1 && q !== row.original.quantity) onQuickChange(row.original, { quantity: q });
                }}
              />
            ) : (
              <>
                {row.original.quantity}
                {row.original.soldAsSet ? <span className="ml-1 text-xs text-glow-700">matched set</span> : null}
              </>
            ),
        }),
        helper.accessor("labelBrand", { header: "Label", sortFn: "alphanumeric" }),
        helper.accessor("makerName", {
          header: "Maker",
          cell: ({ row }) => (
            <span>
              {row.original.makerName ?? "—"}
              <span className="block text-xs text-flash-500">{BASIS_WORDS[row.original.makerBasis]}</span>
            </span>
          ),
        }),
        helper.display({
          id: "codes",
          header: "Codes",
          cell: ({ row }) => (
            <span className="code text-xs">
              {[row.original.sourceCode, row.original.dateCode].filter(Boolean).join(" · ") || "—"}
            </span>
          ),
        }),
        helper.accessor("condition", {
          header: "Condition",
          cell: ({ row }) =>
            editable && onQuickChange ? (
              <select
                defaultValue={row.original.condition}
                className="input py-1"
                aria-label={`Condition of ${row.original.designation}, line ${row.original.position}`}
                onChange={(e) => onQuickChange(row.original, { condition: e.target.value as ItemView["condition"] })}
              >
                {CONDITION_VALUES.map((c) => (
                  <option key={c} value={c}>
                    {CONDITION_WORDS[c]}
                  </option>
                ))}
              </select>
            ) : (
              CONDITION_WORDS[row.original.condition]
            ),
        }),
        helper.accessor("vacuumLoss", {
          header: "Vacuum",
          cell: ({ row }) =>
            editable && onQuickChange ? (
              <label className="inline-flex items-center gap-1 text-xs">
                <input
                  type="checkbox"
                  defaultChecked={row.original.vacuumLoss}
                  onChange={(e) => onQuickChange(row.original, { vacuumLoss: e.target.checked })}
                  aria-label={`White getter on ${row.original.designation}, line ${row.original.position}`}
                />
                {row.original.vacuumLoss ? "lost" : "ok"}
              </label>
            ) : row.original.vacuumLoss ? (
              <span className="font-medium text-fault-700">Lost (white getter)</span>
            ) : (
              "OK"
            ),
        }),
        helper.accessor("tested", { header: "Readings" }),
        helper.display({
          id: "hazards",
          header: "Hazards",
          cell: ({ row }) => row.original.hazards.map((h) => HAZARD_WORDS[h] ?? h).join(", ") || "",
        }),
        ...(editable
          ? [
              helper.display({
                id: "actions",
                header: "",
                cell: ({ row }) => (
                  <span className="flex gap-1">
                    <button
                      type="button"
                      className="btn-quiet px-2 py-1 text-xs"
                      onClick={() => onEdit?.(row.original)}
                      aria-label={`Edit line ${row.original.position}, ${row.original.designation}`}
                    >
                      Edit
                    </button>
                    <button
                      type="button"
                      className="btn-quiet px-2 py-1 text-xs"
                      onClick={() => onRemove?.(row.original)}
                      aria-label={`Remove line ${row.original.position}, ${row.original.designation}`}
                    >
                      Remove
                    </button>
                  </span>
                ),
              }),
            ]
          : []),
      ]),
    [editable, onEdit, onRemove, onQuickChange],
  );

  const table = useTable({
    features,
    columns,
    data,
    getRowId: (r) => r.id,
    globalFilterFn: "includesString",
    state: { globalFilter: filter, grouping: grouped ? ["family"] : [], expanded: true },
    onGlobalFilterChange: (u) => setFilter(typeof u === "function" ? u(filter) : u),
  });

  const leafCount = (rows: { subRows: unknown[] }[]): number =>
    rows.reduce((n, r) => n + (r.subRows.length ? leafCount(r.subRows as never) : 1), 0);
  const tubes = (rows: { original: Row; subRows: unknown[] }[]): number =>
    rows.reduce((n, r) => n + (r.subRows.length ? tubes(r.subRows as never) : r.original.quantity), 0);

  return (
    <div className="space-y-2">
      <div className="flex flex-wrap items-center gap-3">
        <label htmlFor="item-filter" className="label">
          Filter
        </label>
        <input
          id="item-filter"
          className="input max-w-xs py-1.5"
          value={filter}
          onChange={(e) => setFilter(e.target.value)}
          placeholder="Type, label, maker…"
        />
        <label className="inline-flex items-center gap-2 text-sm">
          <input type="checkbox" checked={grouped} onChange={(e) => setGrouped(e.target.checked)} /> Group by type
          family
        </label>
        <span className="text-sm text-flash-600">
          {items.length} lines · {items.reduce((n, i) => n + i.quantity, 0)} tubes
        </span>
      </div>
      {narrow ? (
        <ul className="space-y-2" aria-label="Items" data-testid="items-cards">
          {table.getRowModel().rows.map((row) =>
            row.getIsGrouped() ? (
              <li key={row.id} className="pt-2 font-semibold">
                {String(row.getGroupingValue("family"))}
                <span className="ml-2 text-sm font-normal text-flash-600">
                  {leafCount(row.subRows as never)} lines · {tubes(row.subRows as never)} tubes
                </span>
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
          {items.length === 0 ? (
            <li className="text-flash-600">No items yet: add them by hand or import a CSV.</li>
          ) : null}
        </ul>
      ) : (
        <div className="overflow-x-auto rounded-lg border border-flash-200 bg-white">
          <table className="min-w-full text-sm">
            <thead className="bg-flash-100 text-left text-flash-700">
              {table.getHeaderGroups().map((g) => (
                <tr key={g.id}>
                  {g.headers
                    .filter((h) => !(grouped && h.column.id === "family"))
                    .map((h) => (
                      <th
                        key={h.id}
                        scope="col"
                        className="whitespace-nowrap px-2 py-2 font-medium"
                        aria-sort={
                          h.column.getIsSorted() === "asc"
                            ? "ascending"
                            : h.column.getIsSorted() === "desc"
                              ? "descending"
                              : undefined
                        }
                      >
                        {h.column.getCanSort() && h.column.id !== "actions" ? (
                          <button
                            type="button"
                            onClick={h.column.getToggleSortingHandler()}
                            className="inline-flex items-center gap-1"
                          >
                            <table.FlexRender header={h} />
                            <span aria-hidden="true">
                              {h.column.getIsSorted() === "asc" ? "▲" : h.column.getIsSorted() === "desc" ? "▼" : "↕"}
                            </span>
                          </button>
                        ) : (
                          <table.FlexRender header={h} />
                        )}
                      </th>
                    ))}
                </tr>
              ))}
            </thead>
            <tbody>
              {table.getRowModel().rows.map((row) =>
                row.getIsGrouped() ? (
                  <tr key={row.id} className="border-t border-flash-300 bg-flash-50">
                    <th scope="rowgroup" colSpan={99} className="px-2 py-1.5 text-left font-semibold">
                      {String(row.getGroupingValue("family"))}
                      <span className="ml-2 font-normal text-flash-600">
                        {leafCount(row.subRows as never)} lines · {tubes(row.subRows as never)} tubes
                      </span>
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
              {items.length === 0 ? (
                <tr>
                  <td colSpan={99} className="px-3 py-4 text-flash-600">
                    No items yet: add them by hand or import a CSV.
                  </td>
                </tr>
              ) : null}
            </tbody>
          </table>
        </div>
      )}
    </div>
  );
}
