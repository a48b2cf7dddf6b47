import type { Viewer } from "../auth/guards";
import { ApiError } from "../api/errors";
import type { Lot } from "../../models";

/**
 * Who may see and change a lot, in one place. A lot nobody may see answers
 * 404 rather than 403, so its existence does not leak.
 *  - the house sees every lot;
 *  - the consignor sees their own lots, and edits them while in draft or asked for changes;
 *  - everyone else sees a lot only once it is approved.
 */
export function canView(viewer: Viewer | null, lot: Pick<Lot, "consignorId" | "state">): boolean {
  if (viewer?.roles.includes("admin")) return true;
  if (viewer && lot.consignorId === viewer.id) return true;
  return lot.state === "approved";
}

export function assertCanView(viewer: Viewer | null, lot: Lot | null): Lot {
  if (!lot || !canView(viewer, lot)) throw new ApiError("not_found", "No such lot");
  return lot;
}

/** The consignor's own lot in a state they may change; otherwise 404 or 409. */
export function assertConsignorCanEdit(viewer: Viewer, lot: Lot | null): Lot {
  if (!lot || lot.consignorId !== viewer.id) throw new ApiError("not_found", "No such lot");
  if (!lot.editableByConsignor) {
    throw new ApiError(
      "conflict",
      lot.state === "approved"
        ? "This lot is approved and locked; the house records any correction as an amendment"
        : `This lot is ${lot.state === "in-review" ? "with the house for review" : lot.state} and cannot be changed now`,
    );
  }
  return lot;
}

/** Whether the viewer sees the reserve (the house and the lot's consignor only). */
export function seesReserve(viewer: Viewer | null, lot: Pick<Lot, "consignorId">): boolean {
  return Boolean(viewer && (viewer.roles.includes("admin") || viewer.id === lot.consignorId));
}
