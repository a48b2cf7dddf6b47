/**
 * Construction features as forms and CSV files carry them (text per feature
 * name) and as the attribution code reads them (typed values). Pure.
 */
import {
  BASE_COLOURS,
  BASE_MATERIALS,
  BULB_SHAPES,
  EXHAUST_TIPS,
  FEATURE_KEYS,
  FLASH_PLACES,
  GETTER_POSITIONS,
  GETTER_SHAPES,
  MARKING_METHODS,
  MICA_COATINGS,
  MICA_OUTLINES,
  PLATE_COLOURS,
  PLATE_FASTENINGS,
  PLATE_LENGTHS,
  PLATE_OPENINGS,
  PLATE_SHAPES,
  PLATE_SURFACES,
  SUPPORT_ROD_FINISHES,
  type ConstructionFeatures,
  type FeatureKey,
} from "./construction";

type Choice =
  { kind: "enum"; values: readonly string[] } | { kind: "count"; min: number; max: number } | { kind: "yes-no" };

/** What each feature may hold, and its label in our own words. */
export const FEATURE_FIELDS: Readonly<Record<FeatureKey, { label: string; choice: Choice }>> = {
  plateShape: { label: "Plate shape", choice: { kind: "enum", values: PLATE_SHAPES } },
  plateSurface: { label: "Plate surface", choice: { kind: "enum", values: PLATE_SURFACES } },
  plateColour: { label: "Plate colour", choice: { kind: "enum", values: PLATE_COLOURS } },
  plateLength: { label: "Plate length vs micas", choice: { kind: "enum", values: PLATE_LENGTHS } },
  plateOpenings: { label: "Plate holes or slots", choice: { kind: "enum", values: PLATE_OPENINGS } },
  plateFastening: { label: "Plate fastening", choice: { kind: "enum", values: PLATE_FASTENINGS } },
  plateFastenerCount: { label: "Fasteners per plate side", choice: { kind: "count", min: 0, max: 20 } },
  getterShape: { label: "Getter shape", choice: { kind: "enum", values: GETTER_SHAPES } },
  getterPosition: { label: "Getter position", choice: { kind: "enum", values: GETTER_POSITIONS } },
  flashPlace: { label: "Getter flash on", choice: { kind: "enum", values: FLASH_PLACES } },
  micaCount: { label: "Micas", choice: { kind: "count", min: 1, max: 4 } },
  micaOutline: { label: "Mica outline", choice: { kind: "enum", values: MICA_OUTLINES } },
  micaCoating: { label: "Mica coating", choice: { kind: "enum", values: MICA_COATINGS } },
  micaSpringClips: { label: "Mica spring clips", choice: { kind: "yes-no" } },
  supportRodFinish: { label: "Support rods", choice: { kind: "enum", values: SUPPORT_ROD_FINISHES } },
  bulbShape: { label: "Bulb", choice: { kind: "enum", values: BULB_SHAPES } },
  exhaustTip: { label: "Exhaust tip", choice: { kind: "enum", values: EXHAUST_TIPS } },
  baseMaterial: { label: "Base material", choice: { kind: "enum", values: BASE_MATERIALS } },
  baseColour: { label: "Base colour", choice: { kind: "enum", values: BASE_COLOURS } },
  metalSkirt: { label: "Metal base skirt", choice: { kind: "yes-no" } },
  markingMethod: { label: "Markings", choice: { kind: "enum", values: MARKING_METHODS } },
};

const byLower = new Map(FEATURE_KEYS.map((k) => [k.toLowerCase(), k] as const));
const YES = ["yes", "y", "true", "1"];
const NO = ["no", "n", "false", "0"];

/**
 * Read a text record (form fields, CSV "name=value" pairs; names in any case,
 * values with spaces or hyphens) into typed features. Unknown names and
 * values outside the vocabulary are returned apart, never guessed.
 */
export function featuresFromText(record: Readonly<Record<string, string>>): {
  features: ConstructionFeatures;
  ignored: string[];
} {
  const features: Record<string, unknown> = {};
  const ignored: string[] = [];
  for (const [rawKey, rawValue] of Object.entries(record)) {
    const key = byLower.get(rawKey.replace(/[\s_-]/g, "").toLowerCase());
    const value = rawValue.trim().toLowerCase().replace(/\s+/g, "-");
    if (!value) continue;
    if (!key) {
      ignored.push(rawKey);
      continue;
    }
    const c = FEATURE_FIELDS[key].choice;
    if (c.kind === "enum" && c.values.includes(value)) features[key] = value;
    else if (c.kind === "count" && /^\d+$/.test(value) && Number(value) >= c.min && Number(value) <= c.max)
      features[key] = Number(value);
    else if (c.kind === "yes-no" && (YES.includes(value) || NO.includes(value))) features[key] = YES.includes(value);
    else ignored.push(`${rawKey}=${rawValue}`);
  }
  return { features: features as ConstructionFeatures, ignored };
}

/** Typed features back to text, for forms and storage. */
export function featuresToText(f: ConstructionFeatures): Record<string, string> {
  const out: Record<string, string> = {};
  for (const key of FEATURE_KEYS) {
    const v = f[key];
    if (v === undefined) continue;
    out[key] = typeof v === "boolean" ? (v ? "yes" : "no") : String(v);
  }
  return out;
}
