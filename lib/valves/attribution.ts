/**
 * Attributing a tube to the factory that made it, kept apart from the brand
 * on its label [CTP: label ≠ maker]. Evidence is the EIA source code (which
 * may name the brand owner, so evidence rather than proof) and construction
 * compared with reference profiles of each factory's version of the type.
 *
 * Reference profiles are built only from source-code-confirmed items, never
 * from construction-matched ones, so the library cannot confirm itself.
 */
import {
  FEATURE_GROUPS,
  FEATURE_WEIGHTS,
  recordedFeatures,
  type ConstructionFeatures,
  type FeatureKey,
} from "./construction";

/** How an attribution was reached (our labels). */
export type AttributionBasis = "source-code-confirmed" | "construction-matched" | "unconfirmed";
/** Confidence in an attribution; high only on several independent matching features [CTP]. */
export type Confidence = "high" | "medium" | "low";

/** How often each value of each feature was seen: counts[feature][value]. */
export type FeatureCounts = Partial<Record<FeatureKey, Record<string, number>>>;

/** One factory's version of a type (and era), as seen on reference examples. */
export interface ReferenceProfile {
  profileId: string;
  makerId: string;
  makerName: string;
  typeFamily?: string;
  era?: { from: number; to: number };
  features: FeatureCounts;
  sampleCount: number;
}

/** A maker proposed for a tube, with the evidence for and against. */
export interface MakerCandidate {
  makerId: string;
  makerName: string;
  profileId: string;
  /** Weighted share of compared features the profile agrees with, 0–1. */
  similarity: number;
  confidence: Confidence;
  matching: FeatureKey[];
  conflicting: FeatureKey[];
  /** Features the profile shows only sometimes. */
  partial: FeatureKey[];
  matchingGroups: string[];
  reasons: string[];
}

/** A tube as the attribution code sees it. */
export interface AttributableItem {
  itemId: string;
  typeFamily?: string;
  year?: number;
  labelBrand?: string;
  features: ConstructionFeatures;
  basis?: AttributionBasis;
  makerId?: string;
  makerName?: string;
}

/** The attribution shown in a listing: label brand and attributed maker side by side. */
export interface Attribution {
  labelBrand?: string;
  makerId?: string;
  makerName?: string;
  basis: AttributionBasis;
  confidence: Confidence | null;
  /** Source code and construction point to different makers. */
  disputed: boolean;
  reasons: string[];
}

/** A value seen in at least this share of a profile's examples counts as a match [SUG]. */
export const MATCH_SHARE = 0.5;
/** High confidence needs matches in this many independent sub-assemblies [CTP "several"; number SUG]. */
export const HIGH_CONFIDENCE_GROUPS = 3;
/** …a similarity of at least this [SUG]… */
export const HIGH_CONFIDENCE_SIMILARITY = 0.8;
/** …and a lead of this much over the best other maker [SUG]. */
export const DISTINCT_MARGIN = 0.1;

const CONFIDENCE_ORDER: Record<Confidence, number> = { low: 0, medium: 1, high: 2 };

/** Turn one reference example into a profile with a single sample. */
export function profileFromExample(
  profile: Omit<ReferenceProfile, "features" | "sampleCount">,
  features: ConstructionFeatures,
): ReferenceProfile {
  const counts: FeatureCounts = {};
  for (const [key, value] of recordedFeatures(features)) counts[key] = { [value]: 1 };
  return { ...profile, features: counts, sampleCount: 1 };
}

function compare(features: ConstructionFeatures, profile: ReferenceProfile): Omit<MakerCandidate, "confidence"> {
  const candidate = {
    makerId: profile.makerId,
    makerName: profile.makerName,
    profileId: profile.profileId,
    similarity: 0,
  };
  const matching: FeatureKey[] = [];
  const conflicting: FeatureKey[] = [];
  const partial: FeatureKey[] = [];
  let agreed = 0;
  let weight = 0;
  for (const [key, value] of recordedFeatures(features)) {
    const counts = profile.features[key];
    const total = counts ? Object.values(counts).reduce((sum, c) => sum + c, 0) : 0;
    if (!counts || total === 0) continue;
    const share = (counts[value] ?? 0) / total;
    agreed += FEATURE_WEIGHTS[key] * share;
    weight += FEATURE_WEIGHTS[key];
    if (share >= MATCH_SHARE) matching.push(key);
    else if (share === 0) conflicting.push(key);
    else partial.push(key);
  }
  const matchingGroups = [...new Set(matching.map((key) => FEATURE_GROUPS[key]))];
  return {
    ...candidate,
    similarity: weight === 0 ? 0 : agreed / weight,
    matching,
    conflicting,
    partial,
    matchingGroups,
    reasons: [],
  };
}

function baseConfidence(c: Omit<MakerCandidate, "confidence">): Confidence {
  if (
    c.matchingGroups.length >= HIGH_CONFIDENCE_GROUPS &&
    c.conflicting.length === 0 &&
    c.similarity >= HIGH_CONFIDENCE_SIMILARITY
  )
    return "high";
  if (c.matchingGroups.length >= 2 && c.similarity >= 0.6 && c.conflicting.length <= 1) return "medium";
  return "low";
}

/**
 * Rank makers by how well a tube's construction fits their reference
 * profiles: best profile per maker, most similar first. Profiles of another
 * type family are skipped; a year outside a profile's era caps confidence at
 * medium; high confidence also needs a clear lead over the next maker [SUG].
 */
export function rankMakers(
  features: ConstructionFeatures,
  profiles: readonly ReferenceProfile[],
  options: { typeFamily?: string; year?: number } = {},
): MakerCandidate[] {
  const best = new Map<string, MakerCandidate>();
  for (const profile of profiles) {
    if (options.typeFamily && profile.typeFamily && profile.typeFamily !== options.typeFamily) continue;
    const compared = compare(features, profile);
    if (compared.matching.length + compared.conflicting.length + compared.partial.length === 0) continue;
    let confidence = baseConfidence(compared);
    const candidate: MakerCandidate = { ...compared, confidence };
    candidate.reasons.push(
      `${compared.matching.length} matching feature(s) in ${compared.matchingGroups.length} sub-assembl${compared.matchingGroups.length === 1 ? "y" : "ies"}` +
        (compared.conflicting.length ? `; conflicts: ${compared.conflicting.join(", ")}` : ""),
    );
    const era = profile.era;
    if (
      options.year !== undefined &&
      era &&
      (options.year < era.from || options.year > era.to) &&
      confidence === "high"
    ) {
      confidence = "medium";
      candidate.reasons.push(`${options.year} is outside the reference era ${era.from}–${era.to}`);
    }
    candidate.confidence = confidence;
    const held = best.get(profile.makerId);
    if (!held || candidate.similarity > held.similarity) best.set(profile.makerId, candidate);
  }
  const ranked = [...best.values()].sort(
    (a, b) =>
      b.similarity - a.similarity ||
      b.matchingGroups.length - a.matchingGroups.length ||
      CONFIDENCE_ORDER[b.confidence] - CONFIDENCE_ORDER[a.confidence] ||
      a.makerName.localeCompare(b.makerName),
  );
  if (
    ranked.length > 1 &&
    ranked[0].confidence === "high" &&
    ranked[0].similarity - ranked[1].similarity < DISTINCT_MARGIN
  ) {
    ranked[0].confidence = "medium";
    ranked[0].reasons.push(`${ranked[1].makerName}'s reference fits nearly as well`);
  }
  return ranked;
}

/**
 * Build reference profiles from items whose maker is confirmed by a source
 * code: feature frequencies per maker and type family, with the span of
 * years seen. Construction-matched items are left out on purpose.
 */
export function buildReferenceProfiles(items: readonly AttributableItem[]): ReferenceProfile[] {
  const profiles = new Map<string, ReferenceProfile>();
  for (const item of items) {
    if (item.basis !== "source-code-confirmed" || !item.makerId) continue;
    const profileId = `${item.makerId}:${item.typeFamily ?? "any"}`;
    let profile = profiles.get(profileId);
    if (!profile) {
      profile = {
        profileId,
        makerId: item.makerId,
        makerName: item.makerName ?? item.makerId,
        features: {},
        sampleCount: 0,
      };
      if (item.typeFamily) profile.typeFamily = item.typeFamily;
      profiles.set(profileId, profile);
    }
    profile.sampleCount += 1;
    if (item.year !== undefined) {
      profile.era = profile.era
        ? { from: Math.min(profile.era.from, item.year), to: Math.max(profile.era.to, item.year) }
        : { from: item.year, to: item.year };
    }
    for (const [key, value] of recordedFeatures(item.features)) {
      const counts = (profile.features[key] ??= {});
      counts[value] = (counts[value] ?? 0) + 1;
    }
  }
  return [...profiles.values()];
}

/**
 * Split the unconfirmed shelf: items whose best construction match now
 * reaches `minConfidence` (default high) are proposed for review as
 * construction-matched; the rest stay, with their best candidate if any.
 */
export function unconfirmedShelf(
  items: readonly AttributableItem[],
  profiles: readonly ReferenceProfile[],
  threshold: { minConfidence?: Confidence; minSimilarity?: number } = {},
): {
  proposals: { itemId: string; candidate: MakerCandidate }[];
  remaining: { itemId: string; best?: MakerCandidate }[];
} {
  const minConfidence = threshold.minConfidence ?? "high";
  const proposals: { itemId: string; candidate: MakerCandidate }[] = [];
  const remaining: { itemId: string; best?: MakerCandidate }[] = [];
  for (const item of items) {
    if (item.basis && item.basis !== "unconfirmed") continue;
    const [top] = rankMakers(item.features, profiles, { typeFamily: item.typeFamily, year: item.year });
    const enough =
      top &&
      CONFIDENCE_ORDER[top.confidence] >= CONFIDENCE_ORDER[minConfidence] &&
      top.similarity >= (threshold.minSimilarity ?? 0);
    if (enough) proposals.push({ itemId: item.itemId, candidate: top });
    else remaining.push(top ? { itemId: item.itemId, best: top } : { itemId: item.itemId });
  }
  return { proposals, remaining };
}

/**
 * Decide the attribution shown in a listing. A source-code maker gives
 * "source-code-confirmed": high when construction agrees, medium alone, low
 * and disputed when construction points elsewhere (the code may name the
 * brand owner [EIA-476]). Otherwise a medium-or-better construction match
 * gives "construction-matched"; else "unconfirmed". The label brand is kept
 * apart: rebranding alone is not misdescription [SUG].
 */
export function attribute(input: {
  labelBrand?: string;
  sourceCodeMaker?: { makerId: string; makerName: string };
  ranking?: readonly MakerCandidate[];
}): Attribution {
  const top = input.ranking?.[0];
  const result: Attribution = { basis: "unconfirmed", confidence: null, disputed: false, reasons: [] };
  if (input.labelBrand) {
    result.labelBrand = input.labelBrand;
    result.reasons.push(`label brand "${input.labelBrand}" is recorded apart from the maker`);
  }
  const strongTop = top && CONFIDENCE_ORDER[top.confidence] >= CONFIDENCE_ORDER.medium ? top : undefined;
  if (input.sourceCodeMaker) {
    Object.assign(result, {
      makerId: input.sourceCodeMaker.makerId,
      makerName: input.sourceCodeMaker.makerName,
      basis: "source-code-confirmed",
    });
    if (strongTop && strongTop.makerId !== input.sourceCodeMaker.makerId) {
      result.confidence = "low";
      result.disputed = true;
      result.reasons.push(`construction points to ${strongTop.makerName}; the source code may name the brand owner`);
    } else if (strongTop) {
      result.confidence = "high";
      result.reasons.push("source code and construction agree");
    } else {
      result.confidence = "medium";
      result.reasons.push("source code only: evidence, not proof");
    }
    return result;
  }
  if (strongTop) {
    Object.assign(result, {
      makerId: strongTop.makerId,
      makerName: strongTop.makerName,
      basis: "construction-matched",
      confidence: strongTop.confidence,
    });
    result.reasons.push(...strongTop.reasons);
  }
  return result;
}
