/**
 * Our vocabulary for the construction features dealers compare when they
 * attribute a tube to the factory that made it [CTP]: plates,
 * getter, micas, supports, envelope and base, markings.
 *
 * Every feature is optional: a listing records what can be seen. The value
 * names are our own plain words.
 */
import { z } from "zod";

/** Plate shape seen from above [CTP]. */
export const PLATE_SHAPES = ["flat", "box", "round"] as const;
/** Plate surface [CTP]. */
export const PLATE_SURFACES = ["smooth", "ribbed", "dimpled", "finned"] as const;
/** Plate colour: grey, black (carbonised) or bright metal [CTP]. */
export const PLATE_COLOURS = ["grey", "black", "bright"] as const;
/** Plate length relative to the micas [CTP]. */
export const PLATE_LENGTHS = ["shorter-than-micas", "level-with-micas", "longer-than-micas"] as const;
/** Holes or slots punched in the plates [CTP]. */
export const PLATE_OPENINGS = ["none", "holes", "slots", "holes-and-slots"] as const;
/** How the plate halves are joined [CTP]. */
export const PLATE_FASTENINGS = ["rivets", "staples", "welds"] as const;
/** Getter shape [CTP]. */
export const GETTER_SHAPES = ["ring", "halo", "d-shape", "square", "disc", "wire"] as const;
/** Getter position in the bulb [CTP]. */
export const GETTER_POSITIONS = ["top", "side", "bottom"] as const;
/** Where the getter flash landed: on the dome (mirrored top) or on the side (clear top) [CTP]. */
export const FLASH_PLACES = ["dome", "side"] as const;
/** Outline of the mica spacers [SUG wording]. */
export const MICA_OUTLINES = ["plain", "notched", "shaped"] as const;
/** Mica coating [CTP]. */
export const MICA_COATINGS = ["clear", "coated"] as const;
/** Grid-post and support-rod finish [CTP]. */
export const SUPPORT_ROD_FINISHES = ["bright-nickel", "dark-iron", "copper-coloured"] as const;
/** Bulb shape: shouldered ST, straight T, or the short miniature envelope [CTP]. */
export const BULB_SHAPES = ["shouldered", "straight-tubular", "miniature"] as const;
/** Exhaust tip position [CTP]. */
export const EXHAUST_TIPS = ["top", "bottom"] as const;
/** Base material [CTP]. */
export const BASE_MATERIALS = ["phenolic", "ceramic", "glass", "metal-shell"] as const;
/** Base colour [CTP]. */
export const BASE_COLOURS = ["black", "brown", "grey", "white"] as const;
/** How the label and codes were put on the glass [CTP]. */
export const MARKING_METHODS = ["silk-screen", "stamped", "etched"] as const;

/** Everything that can be recorded about a tube's construction; all optional. */
export interface ConstructionFeatures {
  plateShape?: (typeof PLATE_SHAPES)[number];
  plateSurface?: (typeof PLATE_SURFACES)[number];
  plateColour?: (typeof PLATE_COLOURS)[number];
  plateLength?: (typeof PLATE_LENGTHS)[number];
  plateOpenings?: (typeof PLATE_OPENINGS)[number];
  plateFastening?: (typeof PLATE_FASTENINGS)[number];
  /** Rivets, staples or welds counted on one plate side. */
  plateFastenerCount?: number;
  getterShape?: (typeof GETTER_SHAPES)[number];
  getterPosition?: (typeof GETTER_POSITIONS)[number];
  flashPlace?: (typeof FLASH_PLACES)[number];
  micaCount?: number;
  micaOutline?: (typeof MICA_OUTLINES)[number];
  micaCoating?: (typeof MICA_COATINGS)[number];
  micaSpringClips?: boolean;
  supportRodFinish?: (typeof SUPPORT_ROD_FINISHES)[number];
  bulbShape?: (typeof BULB_SHAPES)[number];
  exhaustTip?: (typeof EXHAUST_TIPS)[number];
  baseMaterial?: (typeof BASE_MATERIALS)[number];
  baseColour?: (typeof BASE_COLOURS)[number];
  metalSkirt?: boolean;
  markingMethod?: (typeof MARKING_METHODS)[number];
}

/** Name of one construction feature. */
export type FeatureKey = keyof ConstructionFeatures;

/**
 * Which sub-assembly each feature belongs to. Features of one sub-assembly
 * tend to change together, so an attribution counts matching groups, not
 * matching features, as independent evidence [CTP: "several independent
 * features"; grouping SUG].
 */
export const FEATURE_GROUPS: Readonly<
  Record<FeatureKey, "plates" | "getter" | "micas" | "supports" | "envelope" | "markings">
> = {
  plateShape: "plates",
  plateSurface: "plates",
  plateColour: "plates",
  plateLength: "plates",
  plateOpenings: "plates",
  plateFastening: "plates",
  plateFastenerCount: "plates",
  getterShape: "getter",
  getterPosition: "getter",
  flashPlace: "getter",
  micaCount: "micas",
  micaOutline: "micas",
  micaCoating: "micas",
  micaSpringClips: "micas",
  supportRodFinish: "supports",
  bulbShape: "envelope",
  exhaustTip: "envelope",
  baseMaterial: "envelope",
  baseColour: "envelope",
  metalSkirt: "envelope",
  markingMethod: "markings",
};

/**
 * Weight of each feature in a similarity score [SUG, house setting].
 * Markings weigh least: a brand owner may have printed its own labels [CTP].
 * Bulb shape and base follow the type more than the factory, so they weigh less too.
 */
export const FEATURE_WEIGHTS: Readonly<Record<FeatureKey, number>> = {
  plateShape: 1,
  plateSurface: 1,
  plateColour: 1,
  plateLength: 1,
  plateOpenings: 1,
  plateFastening: 1,
  plateFastenerCount: 1,
  getterShape: 1,
  getterPosition: 1,
  flashPlace: 0.75,
  micaCount: 0.75,
  micaOutline: 1,
  micaCoating: 0.75,
  micaSpringClips: 0.75,
  supportRodFinish: 0.75,
  bulbShape: 0.5,
  exhaustTip: 0.5,
  baseMaterial: 0.5,
  baseColour: 0.5,
  metalSkirt: 0.5,
  markingMethod: 0.25,
};

/** All feature names, in display order. */
export const FEATURE_KEYS = Object.keys(FEATURE_GROUPS) as FeatureKey[];

/** The recorded (defined) features of an item, as [key, value-as-text] pairs. */
export function recordedFeatures(features: ConstructionFeatures): [FeatureKey, string][] {
  const pairs: [FeatureKey, string][] = [];
  for (const key of FEATURE_KEYS) {
    const value = features[key];
    if (value !== undefined) pairs.push([key, String(value)]);
  }
  return pairs;
}

/** Form and API validation for a feature record (unknown keys refused; count limits are plausibility bounds [SUG]). */
export const constructionFeaturesSchema = z
  .object({
    plateShape: z.enum(PLATE_SHAPES).optional(),
    plateSurface: z.enum(PLATE_SURFACES).optional(),
    plateColour: z.enum(PLATE_COLOURS).optional(),
    plateLength: z.enum(PLATE_LENGTHS).optional(),
    plateOpenings: z.enum(PLATE_OPENINGS).optional(),
    plateFastening: z.enum(PLATE_FASTENINGS).optional(),
    plateFastenerCount: z.number().int().min(0).max(20).optional(),
    getterShape: z.enum(GETTER_SHAPES).optional(),
    getterPosition: z.enum(GETTER_POSITIONS).optional(),
    flashPlace: z.enum(FLASH_PLACES).optional(),
    micaCount: z.number().int().min(1).max(4).optional(),
    micaOutline: z.enum(MICA_OUTLINES).optional(),
    micaCoating: z.enum(MICA_COATINGS).optional(),
    micaSpringClips: z.boolean().optional(),
    supportRodFinish: z.enum(SUPPORT_ROD_FINISHES).optional(),
    bulbShape: z.enum(BULB_SHAPES).optional(),
    exhaustTip: z.enum(EXHAUST_TIPS).optional(),
    baseMaterial: z.enum(BASE_MATERIALS).optional(),
    baseColour: z.enum(BASE_COLOURS).optional(),
    metalSkirt: z.boolean().optional(),
    markingMethod: z.enum(MARKING_METHODS).optional(),
  })
  .strict() satisfies z.ZodType<ConstructionFeatures>;
