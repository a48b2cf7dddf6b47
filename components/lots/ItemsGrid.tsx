"use client";

import { useState } from "react";
import { useNarrow } from "@/components/useNarrow";
import type { ItemView, LotItemView } from "@/lib/services/lots";
import type { QuickChange } from "./items-columns";
import { ItemCards, ItemsTableView, useItemsTable } from "./ItemsGridViews";

type Props = {
  items: LotItemView[];
  editable: boolean;
  onEdit?: (item: ItemView) => void;
  onRemove?: (item: ItemView) => void;
  onQuickChange?: QuickChange;
};

type ToolbarProps = {
  items: LotItemView[];
  filter: string;
  setFilter: (f: string) => void;
  grouped: boolean;
  setGrouped: (g: boolean) => void;
};

/** The filter box, the group-by-family switch and the lot's count of lines and tubes. */
function ItemsToolbar({ items, filter, setFilter, grouped, setGrouped }: ToolbarProps) {
  return (
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
        <input type="checkbox" checked={grouped} onChange={(e) => setGrouped(e.target.checked)} /> Group by type family
      </label>
      <span className="text-sm text-flash-600">
        {items.length} lines · {items.reduce((n, i) => n + i.quantity, 0)} tubes
      </span>
    </div>
  );
}

/**
 * The items of a lot: sortable, filterable, grouped by type family. In a
 * draft the quantity, condition and vacuum-loss cells are edited in place;
 * every control is a native input or button, so the grid works from the keyboard.
 */
export function ItemsGrid({ items, editable, onEdit, onRemove, onQuickChange }: Props) {
  const [filter, setFilter] = useState("");
  const [grouped, setGrouped] = useState(true);
  const narrow = useNarrow();
  const table = useItemsTable(items, { editable, onEdit, onRemove, onQuickChange }, { filter, setFilter, grouped });
  const View = narrow ? ItemCards : ItemsTableView;
  return (
    <div className="space-y-2">
      <ItemsToolbar items={items} filter={filter} setFilter={setFilter} grouped={grouped} setGrouped={setGrouped} />
      <View table={table} grouped={grouped} empty={items.length === 0} />
    </div>
  );
}
