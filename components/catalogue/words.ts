import type { Relation } from "@/lib/catalogue/relations";

/** The catalogue's sale statuses, in words. */
export const STATUS_WORDS: Record<string, string> = {
  approved: "Listed, not yet in a sale",
  upcoming: "In an upcoming sale",
  live: "Bidding open",
  sold: "Sold",
};

export const RELATION_LABEL: Record<Relation, string> = {
  same: "the type searched for",
  exact: "same type, other name",
  premium: "special-quality version",
  near: "routine substitute",
  caveat: "substitute with caveats",
  "sibling-heater": "other heater: not a drop-in",
  "different-base": "other base",
};

export const GRADE_WORDS: Record<string, string> = { strong: "Strong", good: "Good", fair: "Fair", weak: "Weak" };

export const SORT_WORDS: Record<string, string> = {
  relevance: "Best match",
  closing: "Closing soonest",
  newest: "Newest",
  estimate: "Lowest estimate",
};
