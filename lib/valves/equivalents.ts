// Equivalent and substitute types, as typed links, never a
// bare "equals" [SUG]. Most relations here are trade knowledge from memory
// [MEM]; heater figures marked ✓ are checked against data sheets.

import { designationStem, normaliseDesignation } from "./designation/normalise";

/**
 * How a type relates to another:
 * - exact: same type under another name or number (ECC83 / 12AX7)
 * - premium: industrial, military, ruggedised or special-quality version
 * - near: routinely substituted, but heater or ratings differ (6922 / 6DJ8)
 * - caveat: a substitute with caveats (less gain, other ratings, rebias)
 * - sibling-heater: same pinout, different heater (6SN7GT / 12SN7GT): not a drop-in
 * - different-base: similar electrically on another base (6CG7 / 6SN7GT)
 */
export type LinkKind = "exact" | "premium" | "near" | "caveat" | "sibling-heater" | "different-base";

/** A member of a group, linked to the group's anchor type. */
export interface GroupMember {
  readonly designation: string;
  readonly link: LinkKind;
  readonly note: string;
  readonly source: string;
  /** Same type as another non-exact member (E88CC is 6922 under its European name). */
  readonly sameAs?: string;
  /** Rating step within the group: higher replaces lower, not necessarily the reverse. */
  readonly ratingStep?: number;
}

/** A family of related types around one anchor type. */
export interface EquivalentGroup {
  readonly id: string;
  readonly anchor: string;
  readonly anchorRatingStep?: number;
  readonly members: readonly GroupMember[];
  /** Types often mistaken for members, listed so a lookup can warn. */
  readonly notEquivalent?: readonly { readonly designation: string; readonly note: string; readonly source: string }[];
}

const m = (
  designation: string,
  link: LinkKind,
  note: string,
  source = "MEM",
  extra: Partial<GroupMember> = {},
): GroupMember => ({
  designation,
  link,
  note,
  source,
  ...extra,
});

/** The equivalents table. Anchors are the most common trade name of each family. */
export const EQUIVALENT_GROUPS: readonly EquivalentGroup[] = [
  {
    id: "12ax7",
    anchor: "12AX7",
    anchorRatingStep: 0,
    members: [
      m("ECC83", "exact", "European name of the same type"),
      m("12AX7A", "exact", "Controlled heater warm-up for series strings", "MEM", { ratingStep: 1 }),
      m("7025", "premium", "Low-noise, low-hum version"),
      m("12AX7WA", "premium", "Ruggedised (military) version"),
      m("E83CC", "premium", "European special-quality version"),
      m("CV4004", "premium", "UK military special-quality number"),
      m("5751", "caveat", "Same pinout, µ 70 against 100: less gain; heater 0.175/0.35 A"),
      m("12AY7", "caveat", "Same pinout, µ about 40-44: much less gain"),
    ],
  },
  {
    id: "12au7",
    anchor: "12AU7",
    anchorRatingStep: 0,
    members: [
      m("ECC82", "exact", "European name of the same type"),
      m("12AU7A", "exact", "Controlled heater warm-up", "MEM", { ratingStep: 1 }),
      m("5814A", "premium", "Special-quality version; heater about 0.175/0.35 A", "MEM?"),
      m("6189", "premium", "Special-quality version, about 12AU7WA"),
      m("E82CC", "premium", "European special-quality version"),
      m("CV4003", "premium", "UK military special-quality number"),
      m("5963", "caveat", "Computer variant built for switching service; check before audio use"),
    ],
  },
  {
    id: "12at7",
    anchor: "12AT7",
    members: [
      m("ECC81", "exact", "European name of the same type"),
      m("6201", "premium", "Special-quality version"),
      m("6679", "premium", "Special-quality version"),
      m("E81CC", "premium", "European special-quality version"),
    ],
  },
  {
    id: "6dj8",
    anchor: "6DJ8",
    members: [
      m("ECC88", "exact", "European name of the same type; heater 6.3 V 0.365 A", "MEM; heater ✓"),
      m(
        "6922",
        "near",
        "Special-quality version, routinely substituted; heater 0.3 A against 0.365 A",
        "MEM; heater ✓",
      ),
      m("E88CC", "near", "European name of 6922; heater 0.3 A against 0.365 A", "MEM; heater ✓", { sameAs: "6922" }),
      m("7308", "near", "Special-quality version, routinely substituted; heater 0.335 A", "MEM; heater ✓"),
      m("E188CC", "near", "European name of 7308; heater 0.335 A", "MEM; heater ✓", { sameAs: "7308" }),
      m("PCC88", "sibling-heater", "Same pinout but 7 V 0.3 A series-string heater: not a drop-in", "✓"),
      m("7DJ8", "sibling-heater", "US name of PCC88: 7 V 0.3 A heater, not a drop-in", "✓", { sameAs: "PCC88" }),
    ],
  },
  {
    id: "6sn7",
    anchor: "6SN7GT",
    anchorRatingStep: 0,
    members: [
      m("6SN7GTA", "exact", "Higher ratings", "MEM", { ratingStep: 1 }),
      m("6SN7GTB", "exact", "Higher ratings and controlled heater warm-up", "MEM", { ratingStep: 2 }),
      m("6SN7W", "premium", "Ruggedised version"),
      m("6SN7WGT", "premium", "Ruggedised version, GT bulb"),
      m("5692", "premium", "Special-quality version"),
      m("VT231", "premium", "US military number for the type"),
      m(
        "12SN7GT",
        "sibling-heater",
        "Same pinout, 12.6 V 0.3 A heater against 6.3 V 0.6 A: needs a heater change",
        "REG ✓/MEM",
      ),
      m("6CG7", "different-base", "Similar electrically on a noval base, 6.3 V 0.6 A"),
      m("6FQ7", "different-base", "Same as 6CG7 on a noval base", "MEM", { sameAs: "6CG7" }),
      m("6F8G", "different-base", "Similar electrically, octal with a grid top cap"),
      m("7N7", "different-base", "Similar electrically on a loktal base, 6.3 V"),
    ],
    notEquivalent: [
      { designation: "ECC32", note: "Different characteristics despite the octal dual-triode form", source: "MEM" },
      { designation: "ECC33", note: "Different characteristics despite the octal dual-triode form", source: "MEM" },
    ],
  },
  {
    id: "el34",
    anchor: "EL34",
    members: [
      m(
        "6CA7",
        "exact",
        "Nominally the same type, but some sold as 6CA7 were beam tetrodes with different bulbs and curves",
      ),
      m("KT77", "caveat", "Substitute with caveats: different construction and curves; check bias"),
      m("E34L", "caveat", "Substitute with caveats: different ratings; check bias"),
    ],
  },
  {
    id: "el84",
    anchor: "EL84",
    anchorRatingStep: 0,
    members: [
      m("6BQ5", "exact", "US name of the same type"),
      m("E84L", "premium", "Special-quality version"),
      m("7189", "premium", "Upward-rated: replaces 6BQ5, not necessarily the reverse", "MEM", { ratingStep: 1 }),
      m("7189A", "premium", "Upward-rated further: replaces 6BQ5 and 7189, not necessarily the reverse", "MEM", {
        ratingStep: 2,
      }),
    ],
    notEquivalent: [
      { designation: "PL84", note: "A different type, not just EL84 with another heater", source: "MEM" },
      { designation: "UL84", note: "A different type, not just EL84 with another heater", source: "MEM" },
    ],
  },
  {
    id: "6v6",
    anchor: "6V6",
    anchorRatingStep: 0,
    members: [
      m("6V6G", "exact", "Glass, shouldered bulb", "MEM", { ratingStep: 0 }),
      m("6V6GT", "exact", "Glass tubular bulb", "MEM", { ratingStep: 0 }),
      m("6V6GTA", "exact", "Controlled heater warm-up", "MEM", { ratingStep: 1 }),
      m("5871", "premium", "Special-quality version"),
      m("6AQ5", "different-base", "Similar electrically on a 7-pin miniature base"),
      m("EL90", "different-base", "European name of 6AQ5, 7-pin miniature base", "MEM", { sameAs: "6AQ5" }),
    ],
  },
  {
    id: "6l6",
    anchor: "6L6",
    anchorRatingStep: 0,
    members: [
      m("6L6G", "exact", "Glass, shouldered bulb", "MEM", { ratingStep: 0 }),
      m("6L6GA", "near", "Ratings rise with each suffix; lower-rated versions may not suit high-B+ sockets", "MEM", {
        ratingStep: 1,
      }),
      m("6L6GB", "near", "Ratings rise with each suffix; lower-rated versions may not suit high-B+ sockets", "MEM", {
        ratingStep: 2,
      }),
      m(
        "6L6GC",
        "near",
        "Highest-rated glass version (30 W plate): lower-rated versions don't suit 6L6GC sockets at high B+",
        "MEM; 30 W ✓",
        { ratingStep: 3 },
      ),
      m("5881", "premium", "Industrial version, ratings between 6L6GB and 6L6GC", "MEM?", { ratingStep: 2 }),
      m("7581A", "premium", "Industrial upward-rated version", "MEM?", { ratingStep: 4 }),
      m("KT66", "caveat", "Substitute with caveats: about 1.3 A heater against 0.9 A, larger bulb"),
    ],
  },
  {
    id: "5ar4",
    anchor: "5AR4",
    members: [
      m("GZ34", "exact", "European name of the same type"),
      m(
        "5U4GB",
        "caveat",
        "5AR4 replaces it only with caveats: higher DC output, different heater current (1.9 A against 3 A)",
      ),
      m(
        "5Y3GT",
        "caveat",
        "5AR4 replaces it only with caveats: much higher DC output, different heater current (1.9 A against 2 A)",
      ),
    ],
  },
  {
    id: "kt88",
    anchor: "KT88",
    members: [
      m("6550", "near", "Same pinout; ratings, size and bias differ: rebias after swapping", "CTP", { ratingStep: 0 }),
      m("6550A", "near", "Improved 6550; ratings, size and bias differ from KT88: rebias", "CTP", {
        sameAs: "6550",
        ratingStep: 1,
      }),
    ],
  },
  { id: "ef86", anchor: "EF86", members: [m("6267", "exact", "US number of the same type")] },
  { id: "6au6", anchor: "6AU6", members: [m("EF94", "exact", "European name of the same type")] },
  { id: "6ba6", anchor: "6BA6", members: [m("EF93", "exact", "European name of the same type")] },
  { id: "6be6", anchor: "6BE6", members: [m("EK90", "exact", "European name of the same type")] },
  { id: "6x4", anchor: "6X4", members: [m("EZ90", "exact", "European name of the same type")] },
  { id: "6bm8", anchor: "6BM8", members: [m("ECL82", "exact", "European name of the same type")] },
];

/** Every designation named in the equivalents table (members, anchors and warnings). */
export function equivalentNames(): string[] {
  const names = new Set<string>();
  for (const g of EQUIVALENT_GROUPS) {
    names.add(g.anchor);
    for (const x of g.members) names.add(x.designation);
    for (const x of g.notEquivalent ?? []) names.add(x.designation);
  }
  return [...names];
}

/** Whether the result can take the query's place: by rating step where the table gives one. */
export type ReplacementDirection = "both-ways" | "upgrade" | "downgrade" | "check";

/** One related type, with its link relative to the queried type. */
export interface EquivalentMatch {
  readonly designation: string;
  readonly link: LinkKind;
  readonly note: string;
  readonly source: string;
  readonly groupId: string;
  readonly anchor: string;
  /** upgrade: higher-rated, replaces the query but not necessarily the reverse. */
  readonly direction: ReplacementDirection;
}

/** Result of findEquivalents. */
export interface EquivalentsResult {
  readonly query: string;
  readonly normalised?: string;
  /** The listed type the query was matched to when only its US stem matched (6SN7 -> 6SN7GT). */
  readonly resolvedAs?: string;
  readonly matches: readonly EquivalentMatch[];
  /** Types that look related but are not equivalents, with why. */
  readonly notEquivalent: readonly {
    readonly designation: string;
    readonly note: string;
    readonly source: string;
    readonly groupId: string;
  }[];
}

/** Closeness order: lower is closer. A pair linked through an anchor is no closer than its weaker link. */
const LINK_ORDER: Readonly<Record<LinkKind, number>> = {
  exact: 0,
  premium: 1,
  near: 2,
  caveat: 3,
  "sibling-heater": 4,
  "different-base": 5,
};

/**
 * Link between two members that are each linked to the same anchor: the
 * weaker of the two links (exact with premium is premium; 6922 "near" with
 * PCC88 "sibling-heater" is sibling-heater; a heater sibling against a
 * different-base type is different-base).
 */
export function composeLinks(a: LinkKind, b: LinkKind): LinkKind {
  return LINK_ORDER[a] >= LINK_ORDER[b] ? a : b;
}

function memberOf(g: EquivalentGroup, name: string): GroupMember | undefined {
  return g.members.find((x) => x.designation === name);
}
function linkToAnchor(g: EquivalentGroup, name: string): LinkKind {
  return name === g.anchor ? "exact" : (memberOf(g, name)?.link ?? "caveat");
}
function clusterOf(g: EquivalentGroup, name: string): string {
  const x = name === g.anchor ? undefined : memberOf(g, name);
  if (!x || x.link === "exact") return g.anchor;
  return x.sameAs ? clusterOf(g, x.sameAs) : name;
}
function stepOf(g: EquivalentGroup, name: string): number | undefined {
  if (name === g.anchor) return g.anchorRatingStep;
  const x = memberOf(g, name);
  if (!x) return undefined;
  if (x.ratingStep !== undefined) return x.ratingStep;
  if (x.sameAs) return stepOf(g, x.sameAs);
  return x.link === "exact" ? g.anchorRatingStep : undefined;
}

function relate(g: EquivalentGroup, query: string, other: string): EquivalentMatch {
  const sameType = clusterOf(g, query) === clusterOf(g, other);
  const link = sameType ? "exact" : composeLinks(linkToAnchor(g, query), linkToAnchor(g, other));
  const q = memberOf(g, query);
  const o = memberOf(g, other);
  let note: string;
  if (query === g.anchor) note = o?.note ?? "";
  else if (other === g.anchor) note = `${query}: ${q?.note ?? ""}`;
  else if (sameType) note = `Same type as ${query}; relative to ${g.anchor}: ${o?.note ?? ""}`;
  else note = `Both relate to ${g.anchor}. ${query}: ${q?.note ?? ""}. ${other}: ${o?.note ?? ""}`;
  const sources = [...new Set([q?.source, o?.source].filter((s): s is string => Boolean(s)))];
  const qs = stepOf(g, query);
  const os = stepOf(g, other);
  let direction: ReplacementDirection = link === "exact" ? "both-ways" : "check";
  if (qs !== undefined && os !== undefined) direction = os > qs ? "upgrade" : os < qs ? "downgrade" : direction;
  return {
    designation: other,
    link,
    note,
    source: sources.join("; ") || "MEM",
    groupId: g.id,
    anchor: g.anchor,
    direction,
  };
}

function groupNames(g: EquivalentGroup): string[] {
  return [g.anchor, ...g.members.map((x) => x.designation)];
}

function resolve(normalised: string): string | undefined {
  const all = EQUIVALENT_GROUPS.flatMap(groupNames);
  if (all.includes(normalised)) return normalised;
  const stem = designationStem(normalised);
  if (!stem) return undefined;
  return all.find((n) => n === stem) ?? all.find((n) => designationStem(n) === stem);
}

/**
 * Every type related to `designation` in the equivalents table, each with its
 * link kind relative to the query (never a bare "equals"), a note, a source
 * and a replacement direction where ratings are ordered. Looks the query up by
 * any member after normalisation ("ecc-83", "6922"), then by US stem. Also
 * lists look-alikes that are not equivalents (ECC33 for 6SN7GT).
 */
export function findEquivalents(designation: string): EquivalentsResult {
  const n = normaliseDesignation(designation);
  if (!n.ok) return { query: designation, matches: [], notEquivalent: [] };
  const name = resolve(n.value);
  const matches = new Map<string, EquivalentMatch>();
  const warnings: EquivalentsResult["notEquivalent"][number][] = [];
  for (const g of EQUIVALENT_GROUPS) {
    const warned = g.notEquivalent?.find((w) => w.designation === n.value);
    if (warned) warnings.push({ designation: g.anchor, note: warned.note, source: warned.source, groupId: g.id });
    if (!name || !groupNames(g).includes(name)) continue;
    for (const w of g.notEquivalent ?? []) warnings.push({ ...w, groupId: g.id });
    for (const other of groupNames(g)) {
      if (other === name || other === n.value) continue;
      const found = relate(g, name, other);
      const prev = matches.get(other);
      if (!prev || LINK_ORDER[found.link] < LINK_ORDER[prev.link]) matches.set(other, found);
    }
  }
  return {
    query: designation,
    normalised: n.value,
    ...(name && name !== n.value ? { resolvedAs: name } : {}),
    matches: [...matches.values()].sort(
      (a, b) => LINK_ORDER[a.link] - LINK_ORDER[b.link] || a.designation.localeCompare(b.designation),
    ),
    notEquivalent: warnings,
  };
}
