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
};

function flatten(value: unknown, path: string, out: Map<string, string>): void {
  if (value !== null && typeof value === "object") {
    // An empty list or record adds no line: its entries, appearing or going, say what changed.
    const entries = Array.isArray(value) ? value.map((v, i) => [String(i), v] as const) : Object.entries(value);
    for (const [k, v] of entries) flatten(v, path ? `${path}.${k}` : k, out);
  } else {
    out.set(path, value === null ? "none" : String(value));
  }
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
    const where = rest.length ? `${label} ${rest.join(".")}` : label;
    lines.push(`${where}: ${was ?? "—"} → ${now ?? "—"}`);
  }
  return lines;
}
