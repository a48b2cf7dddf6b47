/**
 * Partial refund settlement [SUG]. With W = the claim's reference
 * value owed back (see ./refund-claims) and V_lot the manifest total:
 *   hammer refund         = hammer     × W ÷ V_lot
 *   premium refund        = premium    × W ÷ V_lot   (pro rata of premium charged)
 *   commission reduction  = commission × W ÷ V_lot   (pro rata of commission charged)
 * Rounding: each of the three is rounded once, half-up, on the CUMULATIVE
 * claim value (earlier settled items + these), and the earlier cumulative
 * amounts are subtracted; so refunding in several steps never drifts from
 * refunding once, and a full refund returns exactly what was charged.
 * Per-item figures are split from the totals by largest remainder (./apportion).
 * Reconciliation: buyer refund = hammer refund + premium refund;
 * consignor change = −hammer refund + commission reduction;
 * house change = −premium refund − commission reduction;
 * consignor change + house change = −buyer refund.
 */
import { apportionCents } from "./apportion";
import { assertBasisPoints, assertCents, DEFAULT_ROUNDING, mulDivCents, type RoundingMode } from "./cents";
import { lotValueCents, valueClaimItems, type ClaimItem, type ManifestLine } from "./refund-claims";

/** What was charged on the lot, cents. */
export interface SaleFigures {
  /** Hammer price. */
  hammerCents: number;
  /** Buyer's premium charged. */
  premiumCents: number;
  /** Seller's commission charged to the consignor. */
  commissionCents: number;
}

/** Default share of V_lot above which misdescription lets the buyer reject the whole lot: 25 % [SUG]. */
export const DEFAULT_REJECT_THRESHOLD_BP = 2_500;

/** Options for {@link settlePartialRefund}. */
export interface RefundOptions {
  /** Misdescribed share (basis points of V_lot) that must be EXCEEDED to allow rejection. Default 2,500. */
  rejectThresholdBp?: number;
  /** Claim items already settled on this lot; their refunds are not paid again. */
  priorItems?: readonly ClaimItem[];
  /** Rounding for the three totals. Default half-up. */
  mode?: RoundingMode;
}

/** The refund due on one claim item. */
export interface ItemRefund {
  /** The claim item. */
  item: ClaimItem;
  /** W for this item, cents of reference value. */
  refundValueCents: number;
  /** Its share of the hammer refund. */
  hammerRefundCents: number;
  /** Its share of the premium refund. */
  premiumRefundCents: number;
  /** Its share of the commission reduction. */
  commissionReductionCents: number;
}

/** A reconciled refund: what the buyer gets back and who bears it. */
export interface RefundSettlement {
  /** V_lot. */
  lotValueCents: number;
  /** Σ W of the items settled now. */
  claimValueCents: number;
  /** Described value of all claimed tubes so far (prior + now), for the rejection test. */
  misdescribedValueCents: number;
  /** True when the misdescribed value exceeds the threshold share of V_lot. */
  buyerMayRejectLot: boolean;
  /** Hammer refunded now. */
  hammerRefundCents: number;
  /** Premium refunded now. */
  premiumRefundCents: number;
  /** Commission the house gives back to the consignor now. */
  commissionReductionCents: number;
  /** Paid to the buyer: hammer refund + premium refund. */
  buyerRefundCents: number;
  /** Consignor's balance change: −hammer refund + commission reduction (≤ 0). */
  consignorChangeCents: number;
  /** House's balance change: −premium refund − commission reduction (≤ 0). */
  houseChangeCents: number;
  /** Per-item split (empty for a whole-lot rejection). */
  items: ItemRefund[];
}

function checkSale(sale: SaleFigures): void {
  assertCents(sale.hammerCents, "hammerCents");
  assertCents(sale.premiumCents, "premiumCents");
  assertCents(sale.commissionCents, "commissionCents");
}

/** The three cumulative amounts for a claim value of `w` out of `vLot`. */
function cumulative(sale: SaleFigures, w: number, vLot: number, mode: RoundingMode) {
  return {
    hammer: mulDivCents(sale.hammerCents, w, vLot, mode),
    premium: mulDivCents(sale.premiumCents, w, vLot, mode),
    commission: mulDivCents(sale.commissionCents, w, vLot, mode),
  };
}

function settlement(
  vLot: number,
  claimValueCents: number,
  misdescribedValueCents: number,
  thresholdBp: number,
  amounts: { hammer: number; premium: number; commission: number },
  items: ItemRefund[],
): RefundSettlement {
  return {
    lotValueCents: vLot,
    claimValueCents,
    misdescribedValueCents,
    buyerMayRejectLot: BigInt(misdescribedValueCents) * 10_000n > BigInt(thresholdBp) * BigInt(vLot),
    hammerRefundCents: amounts.hammer,
    premiumRefundCents: amounts.premium,
    commissionReductionCents: amounts.commission,
    buyerRefundCents: amounts.hammer + amounts.premium,
    consignorChangeCents: -amounts.hammer + amounts.commission,
    houseChangeCents: -amounts.premium - amounts.commission,
    items,
  };
}

/**
 * Settles a partial refund (price adjustments, returns, shortfalls, matched
 * set defects) for the given claim items. Worked example [SUG]:
 * hammer $1,000, premium 15 % ($150), commission 20 % ($200), V_lot $2,000,
 * a line described $400 / actual $100 → W $300 → hammer refund $150,
 * premium refund $22.50, commission reduction $30, consignor −$120.
 * Throws if the cumulative claim value would exceed V_lot.
 */
export function settlePartialRefund(
  sale: SaleFigures,
  lines: readonly ManifestLine[],
  items: readonly ClaimItem[],
  options: RefundOptions = {},
): RefundSettlement {
  checkSale(sale);
  const mode = options.mode ?? DEFAULT_ROUNDING;
  const thresholdBp = assertBasisPoints(options.rejectThresholdBp ?? DEFAULT_REJECT_THRESHOLD_BP, "rejectThresholdBp");
  const prior = options.priorItems ?? [];
  const valued = valueClaimItems(lines, [...prior, ...items]);
  const vLot = lotValueCents(lines);
  const priorValued = valued.slice(0, prior.length);
  const nowValued = valued.slice(prior.length);

  const sum = (list: typeof valued, pick: (v: (typeof valued)[number]) => number) =>
    list.reduce((total, v) => total + pick(v), 0);
  const priorW = sum(priorValued, (v) => v.refundValueCents);
  const nowW = sum(nowValued, (v) => v.refundValueCents);
  const misdescribed = sum(valued, (v) => v.describedValueCents);
  if (priorW + nowW > vLot) throw new RangeError("claims exceed the lot's reference value");

  const before = cumulative(sale, priorW, vLot, mode);
  const after = cumulative(sale, priorW + nowW, vLot, mode);
  const amounts = {
    hammer: after.hammer - before.hammer,
    premium: after.premium - before.premium,
    commission: after.commission - before.commission,
  };

  const weights = nowValued.map((v) => v.refundValueCents);
  const split = (total: number) => (nowW > 0 ? apportionCents(total, weights) : weights.map(() => 0));
  const hammerParts = split(amounts.hammer);
  const premiumParts = split(amounts.premium);
  const commissionParts = split(amounts.commission);
  const itemRefunds: ItemRefund[] = nowValued.map((v, i) => ({
    item: v.item,
    refundValueCents: v.refundValueCents,
    hammerRefundCents: hammerParts[i],
    premiumRefundCents: premiumParts[i],
    commissionReductionCents: commissionParts[i],
  }));
  return settlement(vLot, nowW, misdescribed, thresholdBp, amounts, itemRefunds);
}

/**
 * Settles the buyer's rejection of the whole lot (or a full refund, e.g. for
 * re-printed labels): everything still unrefunded is returned —
 * the rest of the hammer and premium to the buyer, the rest of the
 * commission to the consignor. `priorItems` are partial refunds already paid.
 */
export function settleLotRejection(
  sale: SaleFigures,
  lines: readonly ManifestLine[],
  priorItems: readonly ClaimItem[] = [],
  mode: RoundingMode = DEFAULT_ROUNDING,
): RefundSettlement {
  checkSale(sale);
  const vLot = lotValueCents(lines);
  const valued = valueClaimItems(lines, priorItems);
  const priorW = valued.reduce((total, v) => total + v.refundValueCents, 0);
  const misdescribed = valued.reduce((total, v) => total + v.describedValueCents, 0);
  const before = cumulative(sale, priorW, vLot, mode);
  const amounts = {
    hammer: sale.hammerCents - before.hammer,
    premium: sale.premiumCents - before.premium,
    commission: sale.commissionCents - before.commission,
  };
  return settlement(vLot, vLot - priorW, misdescribed, DEFAULT_REJECT_THRESHOLD_BP, amounts, []);
}

/**
 * The sale's figures after refunds already settled (hammer, premium and
 * commission each reduced by the settlements' amounts): what is left to
 * release from escrow.
 */
export function figuresAfterRefunds(sale: SaleFigures, settlements: readonly RefundSettlement[]): SaleFigures {
  checkSale(sale);
  const left = settlements.reduce(
    (acc, s) => ({
      hammerCents: acc.hammerCents - s.hammerRefundCents,
      premiumCents: acc.premiumCents - s.premiumRefundCents,
      commissionCents: acc.commissionCents - s.commissionReductionCents,
    }),
    { ...sale },
  );
  checkSale(left);
  return left;
}

/** The figures of a settlement that a decision records and the mediator's form shows. */
export type SettlementFigures = Pick<
  RefundSettlement,
  | "lotValueCents"
  | "claimValueCents"
  | "hammerRefundCents"
  | "premiumRefundCents"
  | "commissionReductionCents"
  | "buyerRefundCents"
  | "consignorChangeCents"
  | "houseChangeCents"
>;
