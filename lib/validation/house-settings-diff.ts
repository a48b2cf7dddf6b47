/**
 * What one settings version changed from another, as short lines for the history ("Buyer's premium (bp): 1000 →
 * 1500"). Pure: compares the two documents leaf by leaf.
 */
import type { HouseSettings } from "./house-settings";

const SECTION_WORDS: Record<keyof HouseSettings, string> = {
  buyersPremiumBp: "Buyer's premium (bp)",
  commissionTiers: "Commission tiers",
  incrementLadder: "Increment ladder",
  softClose: "Late-bid window",
  inspection: "Inspection",
  claims: "Claims",
  payment: "Payment terms",
  shipping: "Shipping",
  tax: "Tax",
  house: "House details",
};

function flatten(value: unknown, path: string, out: Map<string, string>): void {
  if (value !== null && typeof value === "object") {
    // An empty list or record adds no line: its entries, appearing or going, say what changed.
    const entries = Array.isArray(value) ? value.map((v, i) => [String(i), v] as const) : Object.entries(value);
    for (const [k, v] of entries) flatten(v, path ? `${path}.${k}` : k, out);
  } else {
    out.set(path, value === null ? "none" : value === "" ? "(blank)" : String(value));
  }
}

const UNIT_WORDS: Record<string, string> = {
  bp: "(bp)",
  cents: "($ in cents)",
  pct: "(%)",
  days: "(days)",
  hours: "(hours)",
  seconds: "(seconds)",
  grams: "(g)",
};

/** Steps whose split-up name would not read well. */
const STEP_WORDS: Record<string, string> = {
  line1: "line 1",
  line2: "line 2",
  paperworkEmail: "paperwork e-mail",
};

/** One step of a settings path in words: `rateBp` → "rate (bp)", a list index 0 → "1". */
function stepWords(step: string): string {
  if (STEP_WORDS[step]) return STEP_WORDS[step];
  if (/^\d+$/.test(step)) return String(Number(step) + 1);
  const words = step
    .replace(/([a-z0-9])([A-Z])/g, "$1 $2")
    .toLowerCase()
    .split(" ");
  const unit = UNIT_WORDS[words[words.length - 1]!];
  return unit && words.length > 1 ? `${words.slice(0, -1).join(" ")} ${unit}` : words.join(" ");
}

/** One line per changed leaf, labelled by its section, in a stable order; empty when nothing changed. */
export function settingsChanges(before: HouseSettings, after: HouseSettings): string[] {
  const a = new Map<string, string>();
  const b = new Map<string, string>();
  flatten(before, "", a);
  flatten(after, "", b);
  const keys = [...new Set([...a.keys(), ...b.keys()])].sort();
  const lines: string[] = [];
  for (const key of keys) {
    const was = a.get(key);
    const now = b.get(key);
    if (was === now) continue;
    const [section, ...rest] = key.split(".");
    const label = SECTION_WORDS[section as keyof HouseSettings] ?? section;
    const where = rest.length ? `${label} · ${rest.map(stepWords).join(" ")}` : label;
    lines.push(`${where}: ${was ?? "—"} → ${now ?? "—"}`);
  }
  return lines;
}
