/** Plain words for the codes used in lots, shared by pages and forms. */
export const LOT_STATE_WORDS: Record<string, string> = {
  draft: "Draft",
  "in-review": "With the house",
  "needs-changes": "Changes asked",
  approved: "Approved",
  declined: "Declined",
};

export const TESTER_WORDS: Record<string, string> = {
  untested: "Not tested",
  "mutual-conductance": "Mutual-conductance (Gm) tester",
  emission: "Emission tester",
  "curve-tracer": "Curve tracer",
  other: "Other tester",
};

export const CONDITION_WORDS: Record<string, string> = {
  "new-in-box": "New in box",
  "new-old-stock": "New old stock",
  used: "Used",
};

export const BASIS_WORDS: Record<string, string> = {
  "source-code-confirmed": "Confirmed by source code",
  "construction-matched": "Matched by construction",
  unconfirmed: "Unconfirmed",
};

export const HAZARD_WORDS: Record<string, string> = {
  "beryllium-oxide": "Beryllium-oxide ceramic",
  radioactive: "Radioactive part",
  "mercury-vapour": "Mercury vapour",
  glass: "Large glass envelope",
};

export const EVENT_WORDS: Record<string, string> = {
  created: "Lot started",
  submitted: "Submitted for review",
  "changes-requested": "House asked for changes",
  approved: "Approved by the house",
  declined: "Declined by the house",
  amended: "Amendment after approval",
  imported: "Readings imported",
};
