/**
 * Who may do what on a claim, in one place. The route wrapper has already
 * checked the viewer's permission for the route; these checks are about this
 * one case: a party, the case's own mediator, or an official who reads it.
 */
import type { Transaction } from "sequelize";
import { ApiError } from "../../api/errors";
import type { Viewer } from "../../auth/guards";
import { can } from "../../auth/roles";
import type { CaseRole } from "../../disputes/parties";
import { findDispute, type DisputeRow } from "./tables/disputes";

export type { CaseRole } from "../../disputes/parties";

/** The viewer's role in a case, or null when the case is none of theirs. Mediators may read every case to triage it. */
export function roleIn(
  d: Pick<DisputeRow, "buyer_id" | "consignor_id" | "mediator_id">,
  viewer: Viewer,
): CaseRole | null {
  if (d.buyer_id === viewer.id) return "buyer";
  if (d.consignor_id === viewer.id) return "consignor";
  if (can(viewer.roles, "disputes.mediate")) return "mediator";
  if (can(viewer.roles, "house.manage")) return "house";
  return null;
}

/** The case and the viewer's role in it; 404 when it does not exist or is none of theirs. */
export async function loadCase(
  viewer: Viewer,
  id: string,
  t?: Transaction,
  lock = false,
): Promise<{ d: DisputeRow; role: CaseRole }> {
  const d = await findDispute(id, { t, lock });
  const role = d ? roleIn(d, viewer) : null;
  if (!d || !role) throw new ApiError("not_found", "No such case");
  return { d, role };
}

/** Only mediators may use the queue, take, or decide. */
export function requireMediator(viewer: Viewer, message: string): void {
  if (!can(viewer.roles, "disputes.mediate")) throw new ApiError("forbidden", message);
}

/** Evidence comes from the parties and the case's own mediator, while the case is open. */
export function requireEvidenceWriter(d: DisputeRow, role: CaseRole, viewer: Viewer): void {
  if (role === "house" || (role === "mediator" && d.mediator_id !== viewer.id))
    throw new ApiError("forbidden", "Only the parties and the case's mediator add evidence");
  if (d.state === "closed") throw new ApiError("conflict", "The case is closed");
}

/** Messages come from the parties and the case's own mediator, while the case is open. */
export function requireMessageWriter(d: DisputeRow, role: CaseRole, viewer: Viewer): void {
  if (role === "house")
    throw new ApiError("forbidden", "The house reads cases; the parties and the mediator write in them");
  if (role === "mediator" && d.mediator_id !== viewer.id)
    throw new ApiError("forbidden", "Take the case from the queue before writing in it");
  if (d.state === "closed") throw new ApiError("conflict", "The case is closed");
}

/** The mediator's tools (workspace, refund preview) are for mediators and the house. */
export function requireOfficial(role: CaseRole, allowHouse: boolean): void {
  if (role !== "mediator" && !(allowHouse && role === "house")) throw new ApiError("not_found", "No such case");
}

/** The case's own mediator releases part of the payment. */
export function requireCaseMediator(d: DisputeRow, viewer: Viewer, message: string): void {
  if (d.mediator_id !== viewer.id) throw new ApiError("forbidden", message);
}

/** Only one party takes a step of a return. */
export function requireParty(role: CaseRole, party: "buyer" | "consignor", message: string): void {
  if (role !== party) throw new ApiError("forbidden", message);
}
