// Check values: our own rule [SUG] (lib/lots/comparables.ts): only single-family, single-condition
// lots are comparables; price per tube = net hammer ÷ tubes, rounded half up. Type families follow
// our equivalents table (12AX7 and ECC83 are one family [MEM]). Lot data is invented.
import { describe, expect, it } from "vitest";
import { comparablesFromSoldLots, type SoldLine } from "@/lib/lots/comparables";
import { estimateLot } from "@/lib/lots/estimate";
import { seedReferenceTable } from "@/lib/valves/seed";

const SEED = seedReferenceTable();

const line = (
  lotId: string,
  netHammerCents: number,
  designation: string,
  quantity: number,
  condition: SoldLine["condition"] = "used",
): SoldLine => ({ lotId, netHammerCents, soldAt: "2026-11-20T18:00:00.000Z", designation, condition, quantity });

describe("comparables from our own sold lots [SUG]", () => {
  it("a lot of one family and condition gives one comparable at hammer ÷ tubes", () => {
    expect(comparablesFromSoldLots(SEED, [line("a", 20_000, "12AX7", 10, "new-in-box")])).toEqual([
      { typeFamily: "12AX7", condition: "new-in-box", pricePerTubeCents: 2_000, soldAt: "2026-11-20T18:00:00.000Z" },
    ]);
  });

  it("lines under another name of the same type count as one family [MEM]", () => {
    const [c] = comparablesFromSoldLots(SEED, [line("b", 10_000, "12AX7", 3), line("b", 10_000, "ECC83", 3)]);
    expect(c?.typeFamily).toBe("12AX7");
    expect(c?.pricePerTubeCents).toBe(1_667); // 10,000 ÷ 6 = 1,666.67 → half up
  });

  it("mixed families or conditions are left out, not split by a guess", () => {
    expect(comparablesFromSoldLots(SEED, [line("c", 9_000, "12AX7", 2), line("c", 9_000, "6SN7GT", 2)])).toEqual([]);
    expect(
      comparablesFromSoldLots(SEED, [
        line("d", 9_000, "EL84", 2, "used"),
        line("d", 9_000, "EL84", 2, "new-old-stock"),
      ]),
    ).toEqual([]);
  });

  it("feeds the lot estimate: quartiles of the per-tube prices × tubes", () => {
    const comps = comparablesFromSoldLots(SEED, [
      line("e1", 10_000, "EL84", 4),
      line("e2", 12_000, "EL84", 4),
      line("e3", 16_000, "EL84", 4),
      line("e4", 20_000, "EL84", 4),
    ]); // per tube $25, $30, $40, $50
    const est = estimateLot([{ familyKey: "EL84", familyLabel: "EL84 family", condition: "used", tubes: 6 }], comps);
    expect(est.kind).toBe("range");
    // 25th percentile of [25, 30, 40, 50] at rank 0.75 → $28.75; 75th at rank 2.25 → $42.50 (linear interpolation)
    if (est.kind === "range") expect([est.lowCents, est.highCents]).toEqual([6 * 2_875, 6 * 4_250]);
  });
});
