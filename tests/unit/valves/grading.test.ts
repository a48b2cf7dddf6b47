import { describe, expect, it } from "vitest";
import {
  bandForPercent,
  gradeReading,
  GradingInputError,
  HOUSE_DEFAULT_THRESHOLDS,
  percentOfNew,
  sectionSpreadPct,
} from "../../../lib/valves/grading";

// 12AX7 chart "new" value used in the worked examples: 1,600 µmho [REG ✓].
const CHART_12AX7 = 1600;

describe("percentOfNew [CTP: reading ÷ chart new × 100]", () => {
  it("1,200 against 1,600 → 75 % [CTP]", () => {
    expect(percentOfNew(1200, CHART_12AX7)).toBe(75);
  });
  it("refuses a zero chart value and negative readings", () => {
    expect(() => percentOfNew(1200, 0)).toThrow(GradingInputError);
    expect(() => percentOfNew(-1, 1600)).toThrow(GradingInputError);
  });
});

describe("bandForPercent with the house bands [CTP: ≥100 strong, 80–99 good, 60–79 fair, <60 weak]", () => {
  it.each([
    [120, "strong"],
    [100, "strong"],
    [99.9, "good"],
    [80, "good"],
    [79.9, "fair"],
    [60, "fair"],
    [59.9, "weak"],
    [0, "weak"],
  ])("%d %% → %s", (pct, band) => {
    expect(bandForPercent(pct)).toBe(band);
  });
  it("an optional house reject line turns the lowest band into reject", () => {
    expect(bandForPercent(30, { ...HOUSE_DEFAULT_THRESHOLDS, rejectBelowPct: 40 })).toBe("reject");
    expect(bandForPercent(45, { ...HOUSE_DEFAULT_THRESHOLDS, rejectBelowPct: 40 })).toBe("weak");
  });
});

describe("gradeReading", () => {
  it("Gm 1,200 against chart 1,600 → 75 % → fair [CTP]", () => {
    const result = gradeReading({ measure: "gm", sections: [1200], chartNewValue: CHART_12AX7 });
    expect(result.percentOfNew).toEqual([75]);
    expect(result.grade).toBe("fair");
    expect(result.hardFails).toEqual([]);
  });

  it("any short rejects regardless of Gm [CTP]", () => {
    const result = gradeReading({ measure: "gm", sections: [1800, 1790], chartNewValue: CHART_12AX7, shorts: true });
    expect(result.grade).toBe("reject");
    expect(result.hardFails).toEqual(["short"]);
    expect(result.percentOfNew[0]).toBeCloseTo(112.5, 6);
  });

  it.each([
    ["leakage", "leakage"],
    ["gas", "gas"],
    ["vacuumLoss", "vacuum-loss"],
    ["openHeater", "open-heater"],
  ] as const)("%s rejects a strong tube [CTP: absolute failures]", (flag, fail) => {
    const result = gradeReading({ measure: "gm", sections: [2000], chartNewValue: CHART_12AX7, [flag]: true });
    expect(result.grade).toBe("reject");
    expect(result.hardFails).toEqual([fail]);
  });

  it("a hard failure may come with no readings at all (open heater: nothing to measure)", () => {
    const result = gradeReading({ measure: "gm", sections: [], chartNewValue: CHART_12AX7, openHeater: true });
    expect(result).toMatchObject({ grade: "reject", worstPercentOfNew: null });
  });

  it("the weakest section decides; dual sections report their balance [CTP: sections within ~10–20 %]", () => {
    const result = gradeReading({ measure: "gm", sections: [1700, 1300], chartNewValue: CHART_12AX7 });
    expect(result.grade).toBe("good"); // 1,300/1,600 = 81.25 %
    expect(result.worstPercentOfNew).toBeCloseTo(81.25, 6);
    expect(result.sectionBalance?.spreadPct).toBeCloseTo((400 / 1500) * 100, 6); // 26.7 % > 20 %
    expect(result.sectionBalance?.withinTolerance).toBe(false);
    const balanced = gradeReading({ measure: "gm", sections: [1650, 1600], chartNewValue: CHART_12AX7 });
    expect(balanced.sectionBalance?.withinTolerance).toBe(true);
    expect(balanced.grade).toBe("strong");
  });

  it("per-section chart values are honoured (e.g. a triode-pentode)", () => {
    const result = gradeReading({ measure: "gm", sections: [1000, 5000], chartNewValue: [1000, 6250] });
    expect(result.percentOfNew).toEqual([100, 80]);
    expect(result.grade).toBe("good");
    expect(() => gradeReading({ measure: "gm", sections: [1000], chartNewValue: [1000, 2000] })).toThrow(
      GradingInputError,
    );
  });

  it("emission readings pass or fail only, never a Gm band [CTP: emission testers give relative good/bad]", () => {
    const high = gradeReading({ measure: "emission", sections: [110], chartNewValue: 100 });
    expect(high.grade).toBe("emission-ok");
    expect(high.reasons.join(" ")).toMatch(/not comparable with Gm/);
    const low = gradeReading({ measure: "emission", sections: [50], chartNewValue: 100 });
    expect(low.grade).toBe("weak");
  });

  it("plate-current readings use the same bands", () => {
    expect(gradeReading({ measure: "plate-current", sections: [45], chartNewValue: 45 }).grade).toBe("strong");
  });

  it("refuses nothing-to-grade input and disordered thresholds", () => {
    expect(() => gradeReading({ measure: "gm", sections: [], chartNewValue: 1600 })).toThrow(GradingInputError);
    expect(() =>
      gradeReading(
        { measure: "gm", sections: [1200], chartNewValue: 1600 },
        { ...HOUSE_DEFAULT_THRESHOLDS, goodMinPct: 120 },
      ),
    ).toThrow(GradingInputError);
  });

  it("sectionSpreadPct is (max − min)/mean [SUG]", () => {
    expect(sectionSpreadPct([100, 80])).toBeCloseTo((20 / 90) * 100, 9);
    expect(sectionSpreadPct([100])).toBe(0);
  });
});
