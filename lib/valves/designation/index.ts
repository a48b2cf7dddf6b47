// Public surface of the designation modules.

export { decodeDesignation } from "./decode";
export { normaliseDesignation, designationKey, designationStem, MAX_DESIGNATION_LENGTH } from "./normalise";
export type { NormaliseResult, NormaliseErrorCode } from "./normalise";
export { editDistance, closestNames } from "./edit-distance";
export { knownDesignations, isKnownDesignation, candidateDesignations } from "./known-names";
export { BASE_FAMILY_LABELS, baseFamilyLabel } from "./base-families";
export { EUROPEAN_HEATER_LETTERS, EUROPEAN_SYSTEM_LETTERS } from "./european-tables";
export type * from "./types";
