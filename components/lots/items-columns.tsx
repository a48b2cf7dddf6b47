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
} from "@tanstack/react-table";
import type { ItemView } from "@/lib/services/lots";
import { CONDITION_VALUES } from "@/lib/validation/lots";
import { BASIS_WORDS, CONDITION_WORDS, HAZARD_WORDS } from "./words";

/** One line of the lot as the grid holds it: the item, its type family and how many readings it has. */
export type ItemRow = ItemView & { family: string; tested: number };
export type QuickChange = (
  item: ItemView,
  patch: Partial<Pick<ItemView, "quantity" | "condition" | "vacuumLoss">>,
) => void;
export type ColumnOptions = {
  editable: boolean;
  onEdit?: (item: ItemView) => void;
  onRemove?: (item: ItemView) => void;
  onQuickChange?: QuickChange;
};

export const itemFeatures = tableFeatures({
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
const helper = createColumnHelper<typeof itemFeatures, ItemRow>();

type CellProps = { item: ItemRow; onQuickChange?: QuickChange };

/** Quantity, typed in place in a draft; otherwise the count and whether it sells as a matched set. */
function QuantityCell({ item, onQuickChange }: CellProps) {
  if (!onQuickChange)
    return (
      <>
        {item.quantity}
        {item.soldAsSet ? <span className="ml-1 text-xs text-glow-700">matched set</span> : null}
      </>
    );
  return (
    <input
      type="number"
      min={1}
      defaultValue={item.quantity}
      className="input w-20 py-1"
      aria-label={`Quantity of ${item.designation}, line ${item.position}`}
      onBlur={(e) => {
        const q = Number(e.target.value);
        if (q >= 1 && q !== item.quantity) onQuickChange(item, { quantity: q });
      }}
    />
  );
}

/** Condition, chosen in place in a draft. */
function ConditionCell({ item, onQuickChange }: CellProps) {
  if (!onQuickChange) return CONDITION_WORDS[item.condition];
  return (
    <select
      defaultValue={item.condition}
      className="input py-1"
      aria-label={`Condition of ${item.designation}, line ${item.position}`}
      onChange={(e) => onQuickChange(item, { condition: e.target.value as ItemView["condition"] })}
    >
      {CONDITION_VALUES.map((c) => (
        <option key={c} value={c}>
          {CONDITION_WORDS[c]}
        </option>
      ))}
    </select>
  );
}

/** Vacuum: a white getter flash means the vacuum is lost (a hard fault, in words as well as red). */
function VacuumCell({ item, onQuickChange }: CellProps) {
  if (onQuickChange)
    return (
      <label className="inline-flex items-center gap-1 text-xs">
        <input
          type="checkbox"
          defaultChecked={item.vacuumLoss}
          onChange={(e) => onQuickChange(item, { vacuumLoss: e.target.checked })}
          aria-label={`White getter on ${item.designation}, line ${item.position}`}
        />
        {item.vacuumLoss ? "lost" : "ok"}
      </label>
    );
  return item.vacuumLoss ? <span className="font-medium text-fault-700">Lost (white getter)</span> : "OK";
}

/** Edit and Remove buttons for one line of a draft. */
function LineActions({ item, onEdit, onRemove }: { item: ItemRow } & Pick<ColumnOptions, "onEdit" | "onRemove">) {
  return (
    <span className="flex gap-1">
      <button
        type="button"
        className="btn-quiet px-2 py-1 text-xs"
        onClick={() => onEdit?.(item)}
        aria-label={`Edit line ${item.position}, ${item.designation}`}
      >
        Edit
      </button>
      <button
        type="button"
        className="btn-quiet px-2 py-1 text-xs"
        onClick={() => onRemove?.(item)}
        aria-label={`Remove line ${item.position}, ${item.designation}`}
      >
        Remove
      </button>
    </span>
  );
}

/** What the tube is: family, designation as printed (flagged when unread), quantity, label. */
function typeColumns(quick: QuickChange | undefined) {
  return [
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
      cell: ({ row }) => <QuantityCell item={row.original} onQuickChange={quick} />,
    }),
    helper.accessor("labelBrand", { header: "Label", sortFn: "alphanumeric" }),
  ];
}

/** Who made it and on what basis, with its source and date codes. */
function attributionColumns() {
  return [
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
  ];
}

/** The state it is in: condition, vacuum, readings taken and known hazards. */
function stateColumns(quick: QuickChange | undefined) {
  return [
    helper.accessor("condition", {
      header: "Condition",
      cell: ({ row }) => <ConditionCell item={row.original} onQuickChange={quick} />,
    }),
    helper.accessor("vacuumLoss", {
      header: "Vacuum",
      cell: ({ row }) => <VacuumCell item={row.original} onQuickChange={quick} />,
    }),
    helper.accessor("tested", { header: "Readings" }),
    helper.display({
      id: "hazards",
      header: "Hazards",
      cell: ({ row }) => row.original.hazards.map((h) => HAZARD_WORDS[h] ?? h).join(", ") || "",
    }),
  ];
}

/** The grid's columns in order; in a draft the quick-edit cells and the line actions join them. */
export function itemColumns({ editable, onEdit, onRemove, onQuickChange }: ColumnOptions) {
  const quick = editable ? onQuickChange : undefined;
  return helper.columns([
    ...typeColumns(quick),
    ...attributionColumns(),
    ...stateColumns(quick),
    ...(editable
      ? [
          helper.display({
            id: "actions",
            header: "",
            cell: ({ row }) => <LineActions item={row.original} onEdit={onEdit} onRemove={onRemove} />,
          }),
        ]
      : []),
  ]);
}
