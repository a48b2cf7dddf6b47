/**
 * Lot manifests and the valuation of refund claims against them: partial
 * refunds [SUG]. A manifest has one line per type/grade/attribution
 * or per matched set, each carrying a reference value V in cents; V_lot is
 * their sum. Every claim item is valued as W, the share of reference value
 * the buyer is owed back: described − actual for a price adjustment, the
 * returned or missing value for a return or shortfall. Reference values are
 * weights, not money moved, so they need no rounding here.
 */
import { assertCents } from "./cents";

/** A manifest line of interchangeable single tubes: V = quantity × unit value. */
export interface SinglesLine {
  /** Stable id within the lot. */
  lineId: string;
  /** Discriminant. */
  kind: "singles";
  /** Number of tubes on the line. */
  quantity: number;
  /** Reference value of one tube as described, cents. */
  unitValueCents: number;
}

/**
 * A matched pair/quad/etc. listed as ONE line: V is the set value,
 * and `singleValueCents` is what one of its tubes is worth sold alone.
 */
export interface MatchedSetLine {
  /** Stable id within the lot. */
  lineId: string;
  /** Discriminant. */
  kind: "matched-set";
  /** Tubes in the set (2 for a pair, 4 for a quad). */
  tubeCount: number;
  /** Reference value of the whole set as described, cents. */
  setValueCents: number;
  /** Reference value of one of these tubes as a single, cents. */
  singleValueCents: number;
}

/** One line of a lot manifest. */
export type ManifestLine = SinglesLine | MatchedSetLine;

/** One thing the buyer claims about one manifest line. */
export type ClaimItem =
  /** Buyer keeps `count` singles that are worth `actualUnitValueCents` each, not as described. */
  | { kind: "price-adjustment"; lineId: string; count: number; actualUnitValueCents: number }
  /** Buyer keeps a matched set that is worth `actualSetValueCents` as delivered. */
  | { kind: "set-adjustment"; lineId: string; actualSetValueCents: number }
  /** Buyer sends back `count` singles, or the whole set (count omitted or = tubeCount). */
  | { kind: "return"; lineId: string; count?: number }
  /** `count` singles listed but not delivered. */
  | { kind: "shortfall"; lineId: string; count: number };

/** A claim item with its reference values worked out. */
export interface ValuedClaimItem {
  /** The claim as submitted. */
  item: ClaimItem;
  /** Reference value of the claimed tubes as described, cents (counts towards the rejection threshold). */
  describedValueCents: number;
  /** W: reference value owed back, cents (described − actual, or the returned/missing value). */
  refundValueCents: number;
}

/** Reference value V of one line, cents. */
export function lineValueCents(line: ManifestLine): number {
  return line.kind === "singles" ? line.quantity * line.unitValueCents : line.setValueCents;
}

/** V_lot: the sum of the manifest's line values, cents. */
export function lotValueCents(lines: readonly ManifestLine[]): number {
  return assertCents(
    lines.reduce((sum, line) => sum + lineValueCents(line), 0),
    "lot value",
  );
}

const isCount = (n: number, min: number) => Number.isSafeInteger(n) && n >= min;

/** Lists what is wrong with a manifest (empty = valid). V_lot must be above zero. */
export function validateManifest(lines: readonly ManifestLine[]): string[] {
  const problems: string[] = [];
  const seen = new Set<string>();
  for (const line of lines) {
    if (seen.has(line.lineId)) problems.push(`duplicate line id "${line.lineId}"`);
    seen.add(line.lineId);
    if (line.kind === "singles") {
      if (!isCount(line.quantity, 1)) problems.push(`${line.lineId}: quantity must be a whole number ≥ 1`);
      if (!isCount(line.unitValueCents, 0)) problems.push(`${line.lineId}: unit value must be whole cents ≥ 0`);
    } else {
      if (!isCount(line.tubeCount, 2)) problems.push(`${line.lineId}: a matched set has at least 2 tubes`);
      if (!isCount(line.setValueCents, 0)) problems.push(`${line.lineId}: set value must be whole cents ≥ 0`);
      if (!isCount(line.singleValueCents, 0)) problems.push(`${line.lineId}: single value must be whole cents ≥ 0`);
    }
  }
  if (problems.length === 0 && lines.reduce((sum, l) => sum + lineValueCents(l), 0) <= 0) {
    problems.push("the lot's reference value must be above zero");
  }
  return problems;
}

/**
 * The claim for a matched set with `goodTubes` still good: the
 * buyer is owed the set value minus the good tubes' value as singles, never
 * merely 1/n of the set. Quad at $200, singles $40, one bad:
 * W = 200 − 3 × 40 = $80 (not $50). Never negative.
 */
export function setDefectClaim(line: MatchedSetLine, goodTubes: number): ClaimItem {
  if (!isCount(goodTubes, 0) || goodTubes >= line.tubeCount) {
    throw new RangeError(`goodTubes must be a whole number from 0 to ${line.tubeCount - 1}`);
  }
  const actual = Math.min(line.setValueCents, goodTubes * line.singleValueCents);
  return { kind: "set-adjustment", lineId: line.lineId, actualSetValueCents: actual };
}

function valueOne(line: ManifestLine, item: ClaimItem): { described: number; owed: number; tubes: number } {
  const where = `claim on ${line.lineId}`;
  if (line.kind === "singles") {
    if (item.kind === "set-adjustment") throw new RangeError(`${where}: set-adjustment needs a matched-set line`);
    const count = item.count ?? 0;
    if (!isCount(count, 1)) throw new RangeError(`${where}: count must be a whole number ≥ 1`);
    const described = count * line.unitValueCents;
    if (item.kind !== "price-adjustment") return { described, owed: described, tubes: count };
    const actual = assertCents(item.actualUnitValueCents, `${where}: actual unit value`);
    if (actual > line.unitValueCents) throw new RangeError(`${where}: actual value exceeds the described value`);
    return { described, owed: described - count * actual, tubes: count };
  }
  if (item.kind === "price-adjustment" || item.kind === "shortfall") {
    throw new RangeError(`${where}: a matched set is one line; use set-adjustment (see setDefectClaim) or return`);
  }
  if (item.kind === "return") {
    if (item.count !== undefined && item.count !== line.tubeCount) {
      throw new RangeError(`${where}: a matched set is returned whole`);
    }
    return { described: line.setValueCents, owed: line.setValueCents, tubes: line.tubeCount };
  }
  const actual = assertCents(item.actualSetValueCents, `${where}: actual set value`);
  if (actual > line.setValueCents) throw new RangeError(`${where}: actual value exceeds the described value`);
  return { described: line.setValueCents, owed: line.setValueCents - actual, tubes: line.tubeCount };
}

/**
 * Values each claim item against the manifest. Throws a RangeError for an
 * unknown line, a kind that does not fit the line, an actual value above the
 * described one, or more tubes claimed on a line than it holds (a matched
 * set takes at most one claim item).
 */
export function valueClaimItems(lines: readonly ManifestLine[], items: readonly ClaimItem[]): ValuedClaimItem[] {
  const problems = validateManifest(lines);
  if (problems.length > 0) throw new RangeError(`invalid manifest: ${problems.join("; ")}`);
  const byId = new Map(lines.map((line) => [line.lineId, line]));
  const tubesClaimed = new Map<string, number>();
  return items.map((item) => {
    const line = byId.get(item.lineId);
    if (!line) throw new RangeError(`claim names unknown line "${item.lineId}"`);
    const { described, owed, tubes } = valueOne(line, item);
    const total = (tubesClaimed.get(line.lineId) ?? 0) + tubes;
    const capacity = line.kind === "singles" ? line.quantity : line.tubeCount;
    if (total > capacity) throw new RangeError(`claims on ${line.lineId} cover more tubes than the line holds`);
    tubesClaimed.set(line.lineId, total);
    return { item, describedValueCents: described, refundValueCents: owed };
  });
}
