/**
 * Buyer's premium, seller's commission, invoice totals and consignor payout.
 * Brief §8 [CTP]: premium is a percentage of the hammer price disclosed before
 * bidding; commission 10–25 % of hammer, often sliding, plus optional lot
 * fees; payout = hammer − commission − fees − refunds. Every figure here is a
 * house setting; rounding is once per figure, half-up (see ./cents).
 */
import {
  assertBasisPoints,
  assertCents,
  BASIS_POINTS_PER_WHOLE,
  DEFAULT_ROUNDING,
  divideRounded,
  percentOfCents,
  toSafeCents,
  type RoundingMode,
} from "./cents";

/** One slice of a sliding commission: `rateBp` applies to hammer up to `upToCents` (null = no ceiling). */
export interface CommissionTier {
  /** Upper edge of this slice in cents (inclusive); null on the last tier. */
  upToCents: number | null;
  /** Rate on the hammer falling inside this slice, in basis points. */
  rateBp: number;
}

/**
 * Default sliding commission [SUG house setting; range per CTP]:
 * 20 % of the first $500, 15 % of the part from $500 to $2,500, 10 % above.
 * Tiers are marginal, like tax brackets: a $1,000 hammer pays
 * 20 % × 500 + 15 % × 500 = $175, never 15 % of the whole.
 */
export const DEFAULT_COMMISSION_TIERS: readonly CommissionTier[] = [
  { upToCents: 50_000, rateBp: 2_000 },
  { upToCents: 250_000, rateBp: 1_500 },
  { upToCents: null, rateBp: 1_000 },
];

/** Default buyer's premium: 10 % [SUG; CTP: trade exchanges run lower than the 10–25 % of general sales]. */
export const DEFAULT_BUYERS_PREMIUM_BP = 1_000;

/** What an invoice's sales tax is charged on (jurisdiction-specific). */
export interface TaxBase {
  /** Tax the hammer price. */
  hammer: boolean;
  /** Tax the buyer's premium. */
  premium: boolean;
  /** Tax shipping. */
  shipping: boolean;
}

/** The house's fee settings for a sale. */
export interface FeeSchedule {
  /** Buyer's premium on hammer, basis points. */
  buyersPremiumBp: number;
  /** Marginal commission tiers charged to the consignor. */
  commissionTiers: readonly CommissionTier[];
  /** Sales tax rate, basis points (0 = no tax configured). */
  taxRateBp: number;
  /** Which parts of the invoice the tax applies to. */
  taxBase: TaxBase;
}

/** Default schedule: 10 % premium, default tiers, no tax configured [SUG]. */
export const DEFAULT_FEE_SCHEDULE: FeeSchedule = {
  buyersPremiumBp: DEFAULT_BUYERS_PREMIUM_BP,
  commissionTiers: DEFAULT_COMMISSION_TIERS,
  taxRateBp: 0,
  taxBase: { hammer: true, premium: true, shipping: false },
};

/** Lists what is wrong with a tier table (empty list = valid): ascending ceilings, last open-ended, rates 0–10,000 bp. */
export function validateCommissionTiers(tiers: readonly CommissionTier[]): string[] {
  const problems: string[] = [];
  if (tiers.length === 0) return ["at least one tier is required"];
  let previous = 0;
  tiers.forEach((tier, index) => {
    const last = index === tiers.length - 1;
    if (!Number.isSafeInteger(tier.rateBp) || tier.rateBp < 0 || tier.rateBp > BASIS_POINTS_PER_WHOLE) {
      problems.push(`tier ${index}: rate must be 0–10000 bp`);
    }
    if (last && tier.upToCents !== null) problems.push("the last tier must have no ceiling (upToCents: null)");
    if (!last && tier.upToCents === null) problems.push(`tier ${index}: only the last tier may be open-ended`);
    if (tier.upToCents !== null) {
      if (!Number.isSafeInteger(tier.upToCents) || tier.upToCents <= previous) {
        problems.push(`tier ${index}: ceiling must be a whole number of cents above ${previous}`);
      } else {
        previous = tier.upToCents;
      }
    }
  });
  return problems;
}

/** Buyer's premium = hammer × rate, rounded once (default half-up). */
export function buyersPremiumCents(
  hammerCents: number,
  premiumBp: number,
  mode: RoundingMode = DEFAULT_ROUNDING,
): number {
  assertCents(hammerCents, "hammerCents");
  return percentOfCents(hammerCents, premiumBp, mode);
}

/**
 * Seller's commission with marginal tiers: each slice of the hammer is
 * charged its own rate; the exact sum is rounded once at the end.
 * With the default tiers: $1,000 → $175.00; $3,000 → $450.00.
 */
export function sellersCommissionCents(
  hammerCents: number,
  tiers: readonly CommissionTier[] = DEFAULT_COMMISSION_TIERS,
  mode: RoundingMode = DEFAULT_ROUNDING,
): number {
  assertCents(hammerCents, "hammerCents");
  const problems = validateCommissionTiers(tiers);
  if (problems.length > 0) throw new RangeError(`invalid commission tiers: ${problems.join("; ")}`);
  let floor = 0;
  let basisPointCents = 0n;
  for (const tier of tiers) {
    const ceiling = tier.upToCents ?? Number.MAX_SAFE_INTEGER;
    const slice = Math.max(0, Math.min(hammerCents, ceiling) - floor);
    basisPointCents += BigInt(slice) * BigInt(tier.rateBp);
    floor = ceiling;
    if (hammerCents <= ceiling) break;
  }
  return toSafeCents(divideRounded(basisPointCents, BigInt(BASIS_POINTS_PER_WHOLE), mode));
}

/** A buyer's invoice for one lot, all in cents. */
export interface InvoiceBreakdown {
  /** Hammer price. */
  hammerCents: number;
  /** Buyer's premium. */
  premiumCents: number;
  /** Shipping charged to the buyer. */
  shippingCents: number;
  /** The part of the invoice the tax is charged on. */
  taxableCents: number;
  /** Sales tax. */
  taxCents: number;
  /** hammer + premium + shipping + tax. */
  totalCents: number;
}

/**
 * Builds the buyer's invoice: premium on hammer, then tax on the configured
 * base (hammer/premium/shipping each switchable), tax rounded once per invoice.
 * Example (15 %, no tax): hammer $1,000 + shipping $40 → total $1,190.
 */
export function invoiceFor(
  input: { hammerCents: number; shippingCents: number },
  schedule: FeeSchedule = DEFAULT_FEE_SCHEDULE,
  mode: RoundingMode = DEFAULT_ROUNDING,
): InvoiceBreakdown {
  const hammerCents = assertCents(input.hammerCents, "hammerCents");
  const shippingCents = assertCents(input.shippingCents, "shippingCents");
  assertBasisPoints(schedule.taxRateBp, "taxRateBp");
  const premiumCents = buyersPremiumCents(hammerCents, schedule.buyersPremiumBp, mode);
  const { taxBase } = schedule;
  const taxableCents =
    (taxBase.hammer ? hammerCents : 0) + (taxBase.premium ? premiumCents : 0) + (taxBase.shipping ? shippingCents : 0);
  const taxCents = percentOfCents(taxableCents, schedule.taxRateBp, mode);
  const totalCents = hammerCents + premiumCents + shippingCents + taxCents;
  return {
    hammerCents,
    premiumCents,
    shippingCents,
    taxableCents,
    taxCents,
    totalCents: assertCents(totalCents, "total"),
  };
}

/** What the consignor is owed for one lot. */
export interface PayoutBreakdown {
  /** Hammer price. */
  hammerCents: number;
  /** Seller's commission charged. */
  commissionCents: number;
  /** Lot and other consignor fees. */
  feesCents: number;
  /** Consignor's net share of refunds (hammer refunded − commission given back). */
  refundsCents: number;
  /** hammer − commission − fees − refunds; negative means the consignor owes the house. */
  payoutCents: number;
}

/**
 * Payout = hammer − commission − fees − refunds. `refundsCents` is
 * the consignor's net share, i.e. the negated `consignorChangeCents` of a
 * refund settlement. The result is not clamped: a negative payout is a debt
 * the consignor owes, so the books still reconcile.
 */
export function payoutFor(input: {
  hammerCents: number;
  commissionCents: number;
  feesCents?: number;
  refundsCents?: number;
}): PayoutBreakdown {
  const hammerCents = assertCents(input.hammerCents, "hammerCents");
  const commissionCents = assertCents(input.commissionCents, "commissionCents");
  const feesCents = assertCents(input.feesCents ?? 0, "feesCents");
  const refundsCents = assertCents(input.refundsCents ?? 0, "refundsCents");
  const payoutCents = hammerCents - commissionCents - feesCents - refundsCents;
  return { hammerCents, commissionCents, feesCents, refundsCents, payoutCents };
}
