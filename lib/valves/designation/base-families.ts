// Human-readable names for the base families of lib/valves/index-types.ts.

import type { BaseFamily } from "../index-types";

/**
 * Display label for each base family. Standard base names (B9A, B7G, B8A,
 * B10B, B9G) are those of the European scheme [PE]; "International Octal" and
 * "Loktal" are the US trade names [CTP].
 */
export const BASE_FAMILY_LABELS: Readonly<Record<BaseFamily, string>> = {
  octal: "International Octal",
  noval: "Noval (B9A)",
  "miniature-7-pin": "7-pin miniature (B7G)",
  rimlock: "Rimlock (B8A)",
  loktal: "Loktal (lock-in)",
  "loktal-b10b": "Loktal-type, later B10B",
  magnoval: "Magnoval",
  b9g: "B9G and related",
  subminiature: "Subminiature (wire ends)",
  "four-pin": "Four-pin (pre-octal)",
  "pre-octal": "Five-, six- or seven-pin (pre-octal)",
  "older-european": "Older or miscellaneous European base",
};

/** The label for a base family. */
export function baseFamilyLabel(family: BaseFamily): string {
  return BASE_FAMILY_LABELS[family];
}
