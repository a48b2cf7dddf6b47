/**
 * From a lot's items and the mediator's values to the refund arithmetic of
 * lib/money: one manifest line per item (a matched set is one line), and one
 * claim item per upheld ruling. Pure.
 */
import { setDefectClaim, type ClaimItem, type ManifestLine } from "../money/refund-claims";
import { settlePartialRefund } from "../money/refunds";

/** A lot item as the manifest needs it. */
export interface ManifestItem {
  id: string;
  position: number;
  quantity: number;
  /** Listed as one matched set (pair, quad…). */
  soldAsSet: boolean;
}

/**
 * The mediator's reference value for one line: per tube for singles; for a
 * matched set, the set's value and what one of its tubes is worth alone.
 */
export interface LineValue {
  itemId: string;
  valueCents: number;
  singleValueCents?: number;
}

/** The mediator's ruling on one claimed item. */
export interface Ruling {
  itemId: string;
  upheld: boolean;
  /** Tubes of the item the ruling upholds (a set is ruled on whole, with `tubes` = bad tubes). */
  tubes: number;
  /**
   * What the upheld tubes are worth as delivered: per tube for singles, the
   * whole set's worth for a set. Omitted: nothing for singles; for a set, its
   * good tubes as singles (see setDefectClaim).
   */
  worthCents?: number;
}

/**
 * Starting values for the mediator's table: every tube weighs the same, so the
 * default split is by tube count; a set's single value is its per-tube share.
 * The mediator should replace them with trade values per line.
 */
export function defaultLineValues(items: readonly ManifestItem[], hammerCents: number): LineValue[] {
  const tubes = items.reduce((n, i) => n + i.quantity, 0);
  const perTube = Math.max(1, Math.round(hammerCents / Math.max(1, tubes)));
  return items.map((i) =>
    i.soldAsSet && i.quantity >= 2
      ? { itemId: i.id, valueCents: perTube * i.quantity, singleValueCents: perTube }
      : { itemId: i.id, valueCents: perTube },
  );
}

const lineId = (i: ManifestItem) => `line-${i.position}`;

/** Manifest lines for the lot; throws a RangeError when an item has no value. */
export function buildManifest(items: readonly ManifestItem[], values: readonly LineValue[]): ManifestLine[] {
  const byItem = new Map(values.map((v) => [v.itemId, v]));
  return items.map((i) => {
    const v = byItem.get(i.id);
    if (!v) throw new RangeError(`line ${i.position} has no reference value`);
    if (i.soldAsSet && i.quantity >= 2) {
      return {
        lineId: lineId(i),
        kind: "matched-set",
        tubeCount: i.quantity,
        setValueCents: v.valueCents,
        singleValueCents: v.singleValueCents ?? Math.floor(v.valueCents / i.quantity),
      };
    }
    return { lineId: lineId(i), kind: "singles", quantity: i.quantity, unitValueCents: v.valueCents };
  });
}

/** Claim items for the upheld rulings, valued against the manifest by lib/money. */
export function claimsFromRulings(
  items: readonly ManifestItem[],
  lines: readonly ManifestLine[],
  rulings: readonly Ruling[],
): ClaimItem[] {
  const itemById = new Map(items.map((i) => [i.id, i]));
  const lineById = new Map(lines.map((l) => [l.lineId, l]));
  const claims: ClaimItem[] = [];
  for (const r of rulings) {
    if (!r.upheld || r.tubes <= 0) continue;
    const item = itemById.get(r.itemId);
    if (!item) throw new RangeError("a ruling names an item outside the lot");
    const line = lineById.get(lineId(item))!;
    if (line.kind === "matched-set") {
      if (r.tubes > line.tubeCount) throw new RangeError(`line ${item.position}: the set has ${line.tubeCount} tubes`);
      claims.push(
        r.worthCents === undefined
          ? setDefectClaim(line, line.tubeCount - r.tubes)
          : { kind: "set-adjustment", lineId: line.lineId, actualSetValueCents: r.worthCents },
      );
    } else {
      claims.push({
        kind: "price-adjustment",
        lineId: line.lineId,
        count: r.tubes,
        actualUnitValueCents: r.worthCents ?? 0,
      });
    }
  }
  return claims;
}

/** The three amounts of a sale (cents). */
export interface SaleAmounts {
  hammerCents: number;
  premiumCents: number;
  commissionCents: number;
}

/**
 * The share of a sale a claim cannot touch, for release while it is open
 * [SUG: "release the undisputed share and hold the rest"]. The held
 * part is what refunding every claimed tube in full would cost (the claimed
 * lines' value, a matched set whole, rounded as the refund itself would be);
 * the rest is undisputed. A later partial refund on the same line values can
 * never exceed what is held, because it values the same tubes at most in full.
 */
export function undisputedShare(
  sale: SaleAmounts,
  items: readonly ManifestItem[],
  lines: readonly LineValue[],
  claimed: readonly { itemId: string; tubes: number }[],
): { held: SaleAmounts; undisputed: SaleAmounts } {
  const manifest = buildManifest(items, lines);
  const asFull = claimsFromRulings(
    items,
    manifest,
    claimed.map((c) => {
      const item = items.find((i) => i.id === c.itemId);
      const isSet = Boolean(item?.soldAsSet && item.quantity >= 2);
      return { itemId: c.itemId, upheld: true, tubes: isSet ? item!.quantity : c.tubes, worthCents: 0 };
    }),
  );
  const s = settlePartialRefund(sale, manifest, asFull);
  const held = {
    hammerCents: s.hammerRefundCents,
    premiumCents: s.premiumRefundCents,
    commissionCents: s.commissionReductionCents,
  };
  return {
    held,
    undisputed: {
      hammerCents: sale.hammerCents - held.hammerCents,
      premiumCents: sale.premiumCents - held.premiumCents,
      commissionCents: sale.commissionCents - held.commissionCents,
    },
  };
}
