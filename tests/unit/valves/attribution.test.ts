import { describe, expect, it } from "vitest";
import {
  attribute,
  buildReferenceProfiles,
  profileFromExample,
  rankMakers,
  unconfirmedShelf,
  type AttributableItem,
} from "../../../lib/valves/attribution";
import { constructionFeaturesSchema, type ConstructionFeatures } from "../../../lib/valves/construction";

// DEMO DATA ONLY: the four makers and their construction habits are invented
// (scenario.md; same habits as the demo seeder). These tests check the
// mechanics and the [CTP] rule "high confidence only when several independent
// features match a reference", not any real factory's construction.
const HABITS: Record<string, { name: string; features: ConstructionFeatures }> = {
  aldergrove: {
    name: "Aldergrove Electron Works",
    features: {
      plateShape: "box",
      plateColour: "grey",
      plateSurface: "smooth",
      getterShape: "halo",
      getterPosition: "top",
      micaCount: 3,
      bulbShape: "miniature",
    },
  },
  kestrel: {
    name: "Kestrel Valve Company",
    features: {
      plateShape: "flat",
      plateColour: "black",
      plateSurface: "ribbed",
      getterShape: "d-shape",
      getterPosition: "side",
      micaCount: 2,
      bulbShape: "miniature",
    },
  },
  pellham: {
    name: "Pellham Radio Tube Corp.",
    features: {
      plateShape: "box",
      plateColour: "grey",
      plateSurface: "dimpled",
      plateFastenerCount: 2,
      getterShape: "square",
      getterPosition: "top",
      micaCount: 2,
      bulbShape: "miniature",
    },
  },
  vireo: {
    name: "Vireo Lamp & Valve",
    features: {
      plateShape: "flat",
      plateColour: "bright",
      plateSurface: "finned",
      getterShape: "disc",
      getterPosition: "bottom",
      micaCount: 2,
      bulbShape: "miniature",
    },
  },
};
const PROFILES = Object.entries(HABITS).map(([id, h]) =>
  profileFromExample({ profileId: `${id}:12AX7`, makerId: id, makerName: h.name, typeFamily: "12AX7" }, h.features),
);

describe("rankMakers", () => {
  it("identical features put that maker first with high confidence", () => {
    for (const [id, habit] of Object.entries(HABITS)) {
      const [top, second] = rankMakers(habit.features, PROFILES);
      expect(top.makerId).toBe(id);
      expect(top.similarity).toBe(1);
      expect(top.confidence).toBe("high");
      expect(top.conflicting).toEqual([]);
      expect(second.similarity).toBeLessThan(1);
    }
  });

  it("lists matching and conflicting features separately", () => {
    const tube: ConstructionFeatures = { ...HABITS.pellham.features, getterShape: "halo" };
    const ranking = rankMakers(tube, PROFILES);
    const pellham = ranking.find((c) => c.makerId === "pellham")!;
    expect(pellham.conflicting).toEqual(["getterShape"]);
    expect(pellham.matching).toContain("plateSurface");
    expect(pellham.confidence).not.toBe("high"); // a conflict forbids high confidence
    const aldergrove = ranking.find((c) => c.makerId === "aldergrove")!;
    expect(aldergrove.matching).toContain("getterShape");
    expect(aldergrove.conflicting).toContain("plateSurface");
  });

  it("a single matching feature never gives high confidence [CTP]", () => {
    const [top] = rankMakers({ plateSurface: "finned" }, PROFILES);
    expect(top.makerId).toBe("vireo");
    expect(top.similarity).toBe(1);
    expect(top.confidence).toBe("low");
  });

  it("several features of one sub-assembly count as one piece of evidence [CTP: independent features]", () => {
    const platesOnly: ConstructionFeatures = { plateShape: "flat", plateColour: "black", plateSurface: "ribbed" };
    const [top] = rankMakers(platesOnly, PROFILES);
    expect(top.makerId).toBe("kestrel");
    expect(top.matchingGroups).toEqual(["plates"]);
    expect(top.confidence).toBe("low");
  });

  it("no high confidence when another maker's reference fits nearly as well", () => {
    const twin = profileFromExample(
      { profileId: "twin:12AX7", makerId: "twin", makerName: "Demo Twin Works" },
      HABITS.aldergrove.features,
    );
    const [top] = rankMakers(HABITS.aldergrove.features, [...PROFILES, twin]);
    expect(top.confidence).toBe("medium");
    expect(top.reasons.join(" ")).toMatch(/fits nearly as well/);
  });

  it("skips profiles of another type family and caps confidence outside a profile's era", () => {
    const other = profileFromExample(
      {
        profileId: "aldergrove:6SN7GT",
        makerId: "aldergrove",
        makerName: HABITS.aldergrove.name,
        typeFamily: "6SN7GT",
      },
      HABITS.kestrel.features,
    );
    const ranking = rankMakers(
      HABITS.kestrel.features,
      [other, ...PROFILES.filter((p) => p.makerId !== "aldergrove")],
      { typeFamily: "12AX7" },
    );
    expect(ranking.map((c) => c.makerId)).not.toContain("aldergrove");
    const dated = { ...PROFILES[1], era: { from: 1955, to: 1965 } };
    const [late] = rankMakers(HABITS.kestrel.features, [dated], { year: 1978 });
    expect(late.confidence).toBe("medium");
  });
});

describe("buildReferenceProfiles and unconfirmedShelf", () => {
  const confirmed = (
    itemId: string,
    maker: string,
    year: number,
    features: ConstructionFeatures,
  ): AttributableItem => ({
    itemId,
    typeFamily: "12AX7",
    year,
    features,
    basis: "source-code-confirmed",
    makerId: maker,
    makerName: HABITS[maker].name,
  });
  const unconfirmed = (itemId: string, features: ConstructionFeatures): AttributableItem => ({
    itemId,
    typeFamily: "12AX7",
    features,
    basis: "unconfirmed",
  });

  it("aggregates feature frequencies per maker and type from source-code-confirmed items only", () => {
    const profiles = buildReferenceProfiles([
      confirmed("a1", "pellham", 1958, HABITS.pellham.features),
      confirmed("a2", "pellham", 1963, { ...HABITS.pellham.features, plateFastenerCount: 3 }),
      { ...confirmed("a3", "kestrel", 1960, HABITS.kestrel.features), basis: "construction-matched" },
    ]);
    expect(profiles).toHaveLength(1);
    const [pellham] = profiles;
    expect(pellham).toMatchObject({
      makerId: "pellham",
      typeFamily: "12AX7",
      sampleCount: 2,
      era: { from: 1958, to: 1963 },
    });
    expect(pellham.features.plateFastenerCount).toEqual({ "2": 1, "3": 1 });
    expect(pellham.features.getterShape).toEqual({ square: 2 });
  });

  it("a feature seen in half the examples matches; one never seen conflicts", () => {
    const profiles = buildReferenceProfiles([
      confirmed("a1", "pellham", 1958, HABITS.pellham.features),
      confirmed("a2", "pellham", 1963, { ...HABITS.pellham.features, plateFastenerCount: 3 }),
    ]);
    const [withThree] = rankMakers({ ...HABITS.pellham.features, plateFastenerCount: 3 }, profiles);
    expect(withThree.matching).toContain("plateFastenerCount");
    const [withFour] = rankMakers({ ...HABITS.pellham.features, plateFastenerCount: 4 }, profiles);
    expect(withFour.conflicting).toEqual(["plateFastenerCount"]);
  });

  it("the unconfirmed shelf shrinks as confirmed evidence grows", () => {
    const shelf = [
      unconfirmed("u1", HABITS.pellham.features),
      unconfirmed("u2", HABITS.vireo.features),
      unconfirmed("u3", { plateColour: "grey" }),
    ];
    const before = unconfirmedShelf(shelf, buildReferenceProfiles([]));
    expect(before.proposals).toEqual([]);
    expect(before.remaining.map((r) => r.itemId)).toEqual(["u1", "u2", "u3"]);

    const evidence = [
      confirmed("c1", "pellham", 1959, HABITS.pellham.features),
      confirmed("c2", "vireo", 1961, HABITS.vireo.features),
    ];
    const after = unconfirmedShelf(shelf, buildReferenceProfiles(evidence));
    expect(after.proposals.map((p) => [p.itemId, p.candidate.makerId])).toEqual([
      ["u1", "pellham"],
      ["u2", "vireo"],
    ]);
    expect(after.remaining.map((r) => r.itemId)).toEqual(["u3"]); // one feature: never enough
    const lenient = unconfirmedShelf(shelf, buildReferenceProfiles(evidence), { minConfidence: "low" });
    expect(lenient.proposals).toHaveLength(3);
  });
});

describe("attribute: label brand kept apart from the attributed maker [CTP: label ≠ maker]", () => {
  const pellhamRanking = rankMakers(HABITS.pellham.features, PROFILES);

  it("demo story: a 'Fairmont Home Radio' tube with Pellham's code and construction is Pellham-made, high confidence", () => {
    const result = attribute({
      labelBrand: "Fairmont Home Radio",
      sourceCodeMaker: { makerId: "pellham", makerName: HABITS.pellham.name },
      ranking: pellhamRanking,
    });
    expect(result).toMatchObject({
      labelBrand: "Fairmont Home Radio",
      makerId: "pellham",
      basis: "source-code-confirmed",
      confidence: "high",
      disputed: false,
    });
  });

  it("a source code alone is evidence, not proof: medium [EIA-476: code may name the brand owner]", () => {
    const result = attribute({ sourceCodeMaker: { makerId: "kestrel", makerName: HABITS.kestrel.name } });
    expect(result.confidence).toBe("medium");
  });

  it("source code and construction disagreeing is marked disputed with low confidence", () => {
    const result = attribute({
      labelBrand: "Kestrel Valve Company",
      sourceCodeMaker: { makerId: "kestrel", makerName: HABITS.kestrel.name },
      ranking: pellhamRanking,
    });
    expect(result).toMatchObject({ makerId: "kestrel", confidence: "low", disputed: true });
    expect(result.reasons.join(" ")).toMatch(/Pellham/);
  });

  it("construction alone gives construction-matched; weak evidence leaves it unconfirmed", () => {
    expect(attribute({ ranking: pellhamRanking })).toMatchObject({
      basis: "construction-matched",
      makerId: "pellham",
      confidence: "high",
    });
    const weak = attribute({
      labelBrand: "Tri-County Parts",
      ranking: rankMakers({ plateColour: "bright" }, PROFILES),
    });
    expect(weak).toMatchObject({ basis: "unconfirmed", labelBrand: "Tri-County Parts", confidence: null });
    expect(weak.makerId).toBeUndefined();
  });
});

describe("constructionFeaturesSchema", () => {
  it("accepts our vocabulary and refuses unknown words and keys", () => {
    expect(constructionFeaturesSchema.safeParse(HABITS.pellham.features).success).toBe(true);
    expect(constructionFeaturesSchema.safeParse({ getterShape: "star" }).success).toBe(false);
    expect(constructionFeaturesSchema.safeParse({ plateHue: "grey" }).success).toBe(false);
  });
});
