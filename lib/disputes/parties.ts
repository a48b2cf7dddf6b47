/** Who acts on a claim: its two parties and the two officials who may read it [SUG: our own names]. */
export const CASE_ROLES = ["buyer", "consignor", "mediator", "house"] as const;

/** A case party's or official's role in one claim. */
export type CaseRole = (typeof CASE_ROLES)[number];
