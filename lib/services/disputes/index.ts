/**
 * Buyers' claims on delivered lots, by use case. Callers may import a use
 * case's module directly; this index keeps the service's public names in one
 * list.
 */
export { openDispute } from "./open";
export { addDisputePhoto, readDisputePhoto } from "./evidence";
export { postMessage } from "./conversation";
export { getCase, mediationQueue, myCases } from "./cases";
export { refundPreview, takeCase, workspace } from "./mediation";
export { decide } from "./decide";
export { releaseUndisputedShare } from "./early-release";
export { settleDecision } from "./settle";
export { confirmReturnReceived, recordReturn } from "./returns";
export { disputeSweep } from "./sweep";
export { roleIn, type CaseRole } from "./permissions";
export type { CaseSummary, CaseView } from "./presenters";
