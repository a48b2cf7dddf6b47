import { describe, expect, it } from "vitest";
import { HAZARD_CAUTIONS, hazardsForType } from "@/lib/valves/hazards";
import type { HazardKind } from "@/lib/valves/index-types";
import { seedReferenceTable } from "@/lib/valves/seed";

const SEED = seedReferenceTable();

// Brief section 7 (hazards and cautions): [MEM/CTP]; carrier rules [MEM, verify].

const kinds = (designation: string, declared: HazardKind[] = []) =>
  hazardsForType(SEED, designation, declared).notices.map((n) => n.kind);

describe("hazardsForType", () => {
  it("every valve carries high-voltage and glass notices", () => {
    // [MEM/CTP] testers apply hundreds of volts; glass can crack or implode
    for (const t of ["12AX7", "6L6GC", "0A2", "6ZZ99"]) {
      const r = hazardsForType(SEED, t);
      expect(r.notices[0]).toMatchObject({ kind: "high-voltage", certainty: "always" });
      expect(r.notices[1]).toMatchObject({ kind: "glass", certainty: "always" });
    }
  });

  it("mercury-vapour rectifiers: 83, 866A, 872A", () => {
    // [MEM, verify]
    for (const t of ["83", "866A", "872A"]) {
      const r = hazardsForType(SEED, t);
      const m = r.notices.find((n) => n.kind === "mercury-vapour");
      expect(m?.certainty, t).toBe("known");
      expect(r.known).toBe(true);
    }
    expect(kinds("5AR4")).not.toContain("mercury-vapour");
  });

  it("cold-cathode regulators: a possible radioactive priming source", () => {
    // [MEM, verify] some regulators held priming sources, not always marked
    const r = hazardsForType(SEED, "0A2");
    expect(r.notices.find((n) => n.kind === "radioactive")?.certainty).toBe("possible");
    expect(kinds("12AX7")).not.toContain("radioactive");
  });

  it("large envelopes get the stronger glass caution", () => {
    // [CTP] large envelopes are worst
    const large = hazardsForType(SEED, "KT88").notices.find((n) => n.kind === "glass")!;
    const small = hazardsForType(SEED, "12AX7").notices.find((n) => n.kind === "glass")!;
    expect(large.note).toBe("Large envelope");
    expect(large.caution.length).toBeGreaterThan(small.caution.length);
    expect(large.caution).toMatch(/5 cm/);
  });

  it("normalises and resolves aliases", () => {
    expect(hazardsForType(SEED, "oa2").designation).toBe("0A2");
    expect(kinds("866-a")).toContain("mercury-vapour");
  });

  it("unknown types get the general notices and advice", () => {
    const r = hazardsForType(SEED, "6ZZ99");
    expect(r.known).toBe(false);
    expect(r.notices.map((n) => n.kind)).toEqual(["high-voltage", "glass"]);
    expect(r.advice).toMatch(/data sheet/);
  });

  it("adds seller-declared hazards once", () => {
    // [MEM] some ceramic RF and planar types use beryllium oxide; listings must flag it
    const r = hazardsForType(SEED, "6ZZ99", ["beryllium-oxide", "glass"]);
    expect(r.notices.map((n) => n.kind)).toEqual(["high-voltage", "glass", "beryllium-oxide"]);
    expect(r.notices[2].certainty).toBe("declared");
    const again = hazardsForType(SEED, "0A2", ["radioactive"]);
    expect(again.notices.filter((n) => n.kind === "radioactive")).toHaveLength(1);
  });
});

describe("caution texts", () => {
  it("each kind has a title, a caution and a source", () => {
    for (const [kind, c] of Object.entries(HAZARD_CAUTIONS)) {
      expect(c.title.length, kind).toBeGreaterThan(0);
      expect(c.caution.length, kind).toBeGreaterThan(40);
      expect(c.source.length, kind).toBeGreaterThan(0);
    }
  });

  it("defer to local rules, carriers or licensed practice", () => {
    for (const kind of ["high-voltage", "beryllium-oxide", "radioactive", "mercury-vapour"] as const) {
      expect(HAZARD_CAUTIONS[kind].caution, kind).toMatch(/local|carrier|competent/);
    }
  });

  it("state the key facts [MEM, verify]", () => {
    // [MEM] UN2911 excepted packages; UN3506 mercury; heater-only warm-up; BeO dust
    expect(HAZARD_CAUTIONS.radioactive.caution).toMatch(/UN2911/);
    expect(HAZARD_CAUTIONS["mercury-vapour"].caution).toMatch(/UN3506/);
    expect(HAZARD_CAUTIONS["mercury-vapour"].caution).toMatch(/heater alone/);
    expect(HAZARD_CAUTIONS["beryllium-oxide"].caution).toMatch(/dust/);
    expect(HAZARD_CAUTIONS["high-voltage"].caution).toMatch(/never asked to power/);
  });
});
