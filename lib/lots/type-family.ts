/**
 * Type families for grouping a lot: designations that are the same type under
 * another name, or its premium/ruggedised version, fall in one family
 * (12AX7, ECC83, 12AX7A, 7025 -> "12AX7 family").
 *
 * Built from our own tables: the equivalents table's "exact" and "premium"
 * links to each group's anchor, members named as the same type as another
 * ("sameAs": E88CC with 6922), and the house's reference table's aliases
 * [MEM, as those tables]. Rebuilt once per reference-table revision. "Near", "caveat", heater-sibling and other-base links never
 * join a family: those tubes are priced and matched apart [SUG].
 */
import { designationStem, normaliseDesignation } from "../valves/designation";
import { EQUIVALENT_GROUPS } from "../valves/equivalents";
import { derivedFrom, type ReferenceTable } from "../valves/reference-table";

/**
 * How a family was found: "listed" (the designation is in our tables),
 * "stem" (an unlisted suffix variant of a listed US number, 12AU7WA -> 12AU7),
 * "unlisted" (a well-formed designation we do not know: its own family),
 * "invalid" (not readable as a designation).
 */
export type FamilyMatch = "listed" | "stem" | "unlisted" | "invalid";

/** A family key for grouping and a label for people. */
export interface TypeFamily {
  /** Stable key: the family's lead designation, the normalised designation, or "unidentified". */
  key: string;
  label: string;
  match: FamilyMatch;
}

/** Key of the family for designations that cannot be read. Lower case, so no designation can collide. */
export const UNIDENTIFIED_FAMILY_KEY = "unidentified";

interface FamilyIndex {
  /** Designation -> lead designation of its family. */
  lead: Map<string, string>;
  /** Lead designation -> members in table order. */
  members: Map<string, string[]>;
  /** US stem -> lead, for stems whose listed variants all share one family. */
  stems: Map<string, string>;
}

function buildIndex(table: ReferenceTable): FamilyIndex {
  const rows = table.rows;
  const parent = new Map<string, string>();
  const order: string[] = [];
  const find = (x: string): string => {
    if (!parent.has(x)) {
      parent.set(x, x);
      order.push(x);
    }
    let root = x;
    while (parent.get(root) !== root) root = parent.get(root)!;
    parent.set(x, root);
    return root;
  };
  // Leads: equivalents anchors first (table order), then reference designations.
  const rank = new Map<string, number>();
  const union = (a: string, b: string) => {
    const [ra, rb] = [find(a), find(b)];
    if (ra === rb) return;
    const [keep, drop] = (rank.get(ra) ?? Infinity) <= (rank.get(rb) ?? Infinity) ? [ra, rb] : [rb, ra];
    parent.set(drop, keep);
  };
  EQUIVALENT_GROUPS.forEach((g, i) => rank.set(g.anchor, i));
  rows.forEach((r, i) => {
    if (!rank.has(r.designation)) rank.set(r.designation, EQUIVALENT_GROUPS.length + i);
  });
  for (const g of EQUIVALENT_GROUPS) {
    find(g.anchor);
    for (const m of g.members) {
      find(m.designation);
      if (m.link === "exact" || m.link === "premium") union(g.anchor, m.designation);
      if (m.sameAs) union(m.sameAs, m.designation);
    }
  }
  for (const r of rows) {
    find(r.designation);
    for (const a of r.aliases) union(r.designation, a);
  }
  const lead = new Map<string, string>();
  const members = new Map<string, string[]>();
  const stemLeads = new Map<string, Set<string>>();
  for (const name of order) {
    const root = find(name);
    lead.set(name, root);
    members.set(root, [...(members.get(root) ?? []), name]);
    const stem = designationStem(name);
    if (stem) stemLeads.set(stem, (stemLeads.get(stem) ?? new Set()).add(root));
  }
  const stems = new Map<string, string>();
  for (const [stem, roots] of stemLeads) if (roots.size === 1) stems.set(stem, [...roots][0]);
  return { lead, members, stems };
}

function familyIndex(table: ReferenceTable): FamilyIndex {
  return derivedFrom(table, "type-families", buildIndex);
}

const familyLabel = (lead: string) => `${lead} family`;

/**
 * The family of a designation, after normalisation: listed names go to their
 * family's lead ("ecc-83" -> key "12AX7", label "12AX7 family"); an unlisted
 * US suffix variant goes to the family of its stem when every listed variant
 * of that stem is in one family (6SN7 -> 6SN7GT family, but 6L6GD stays its
 * own because 6L6GA, 6L6GB and 6L6GC are rated apart); other unknown
 * designations are their own family under their normalised form; unreadable
 * ones are "Unidentified".
 */
export function typeFamily(table: ReferenceTable, designation: string): TypeFamily {
  const n = normaliseDesignation(designation);
  if (!n.ok) return { key: UNIDENTIFIED_FAMILY_KEY, label: "Unidentified", match: "invalid" };
  const { lead, stems } = familyIndex(table);
  const listed = lead.get(n.value);
  if (listed) return { key: listed, label: familyLabel(listed), match: "listed" };
  const stem = designationStem(n.value);
  const viaStem = stem ? stems.get(stem) : undefined;
  if (viaStem) return { key: viaStem, label: familyLabel(viaStem), match: "stem" };
  return { key: n.value, label: n.value, match: "unlisted" };
}

/** Listed designations in a family, lead first; empty for unlisted keys. */
export function familyMembers(table: ReferenceTable, key: string): string[] {
  return [...(familyIndex(table).members.get(key) ?? [])];
}
