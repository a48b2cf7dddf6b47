/** Small helpers the claim use cases share. */
import type { LineValue, ManifestItem } from "../../disputes/manifest";
import type { LotItemRow } from "./tables/lot-items";

export const DAY_MS = 86_400_000;

/** A lot item as the refund arithmetic sees it. */
export const asManifestItem = (i: LotItemRow): ManifestItem => ({
  id: i.id,
  position: i.position,
  quantity: i.quantity,
  soldAsSet: i.sold_as_set,
});

const lineKey = (l: LineValue) => `${l.itemId}:${l.valueCents}:${l.singleValueCents ?? ""}`;

/** True when two sets of line values are the same, in any order. */
export function sameLines(a: readonly LineValue[], b: readonly LineValue[]): boolean {
  const x = a.map(lineKey).sort();
  const y = b.map(lineKey).sort();
  return x.length === y.length && x.every((k, i) => k === y[i]);
}
