import { describe, expect, it } from "vitest";
import { gradeBatch } from "../../../lib/valves/grade-batch";

describe("gradeBatch", () => {
  it("grades against the chart and rejects hard faults whatever the reading", () => {
    const r = gradeBatch({
      measure: "gm",
      chartNewValue: 1600, // [REG ✓] 12AX7 nominal Gm 1,600 µmho, used here as the chart's "new" value
      tolerancePct: 5,
      tubes: [
        { id: "a", sections: [1200, 1200] }, // 75 % of new → fair [CTP bands]
        { id: "b", sections: [1700, 1650] }, // ≥ 100 % → strong [CTP]
        { id: "c", sections: [1700, 1700], shorts: true }, // any short → reject [CTP]
        { id: "d", sections: [1600, 1600], vacuumLoss: true }, // white getter → reject [CTP]
      ],
    });
    const by = Object.fromEntries(r.grades.map((g) => [g.id, g.grade]));
    expect(by).toEqual({ a: "fair", b: "strong", c: "reject", d: "reject" });
    expect(r.counts.reject).toBe(2);
  });

  it("matches only passing tubes: 2,000 and 2,100 pair at 5 %, 2,150 does not [CTP]", () => {
    const r = gradeBatch({
      measure: "gm",
      chartNewValue: 2000,
      tolerancePct: 5,
      tubes: [
        { id: "p1", sections: [2000] },
        { id: "p2", sections: [2100] }, // spread 100/2050 = 4.9 %
        { id: "q1", sections: [3000] },
        { id: "q2", sections: [3225] }, // spread 225/3112.5 = 7.2 %: fails 5 %
        { id: "bad", sections: [2050], gas: true },
      ],
    });
    expect(r.pairs!.sets.map((s) => s.ids)).toEqual([["p1", "p2"]]);
    expect(r.pairs!.unmatched.sort()).toEqual(["q1", "q2"]);
  });

  it("never matches emission readings against anything [CTP]", () => {
    const r = gradeBatch({
      measure: "emission",
      chartNewValue: 100,
      tolerancePct: 5,
      tubes: [
        { id: "e", sections: [90] },
        { id: "f", sections: [91] },
      ],
    });
    expect(r.pairs).toBeNull();
    expect(r.grades.every((g) => g.grade === "emission-ok")).toBe(true);
  });

  it("reports a tube without a chart value as not graded instead of guessing", () => {
    const r = gradeBatch({ measure: "gm", tolerancePct: 5, tubes: [{ id: "x", sections: [1500] }] });
    expect(r.grades[0]).toMatchObject({ id: "x", grade: "not-graded" });
  });
});
