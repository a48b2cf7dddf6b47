/** Releasing the share of a lot a claim does not touch, while the claim is open [SUG]. */
import { ApiError } from "../../api/errors";
import type { Viewer } from "../../auth/guards";
import { undisputedShare } from "../../disputes/manifest";
import { formatCents } from "../../money/cents";
import type { LineValuesInput } from "../../validation/disputes";
import { releaseUndisputed } from "../escrow";
import { notice } from "./mail";
import { saleOf } from "./mediation";
import { loadCase, requireCaseMediator } from "./permissions";
import { asManifestItem, sameLines } from "./shared";
import { clearHeldLines, findDispute, holdLines, markUndisputedReleased } from "./tables/disputes";
import { claimedTubes } from "./tables/dispute-items";
import { claimInvoice } from "./tables/invoices";
import { lotItems } from "./tables/lot-items";
import { casePath, undisputedReleasedNotice } from "./templates";

/**
 * The case's mediator releases the share of the lot the claim does not touch
 * [SUG], on line values they set now and keep for the decision. Not
 * when the buyer asks to return the whole lot. Once per case; a retry
 * finishes an interrupted release.
 */
export async function releaseUndisputedShare(viewer: Viewer, id: string, input: LineValuesInput) {
  const { d } = await loadCase(viewer, id);
  requireCaseMediator(d, viewer, "Only the case's mediator releases part of the payment");
  if (d.decided_at) throw new ApiError("conflict", "The case is decided; the decision released what was due");
  if (d.remedy === "return-whole-lot")
    throw new ApiError("conflict", "The buyer asks to return the whole lot: no share of it is undisputed");
  const claimedLines = await holdLines(id, input.lines);
  const fresh = await findDispute(id);
  const held = fresh?.held_lines ?? null;
  if (!claimedLines && !sameLines(held ?? [], input.lines))
    throw new ApiError("conflict", "The undisputed share was already released on other line values");
  if (!fresh || !held) throw new Error(`claim ${id}: line values were fixed but are not on the row`);
  const inv = await claimInvoice(d.invoice_id);
  const items = await lotItems(d.lot_id);
  const claimed = await claimedTubes(id);
  let share;
  try {
    share = undisputedShare(
      saleOf(inv),
      items.map(asManifestItem),
      held,
      claimed.map((c) => ({ itemId: c.lot_item_id, tubes: c.tubes })),
    );
  } catch (e) {
    if (claimedLines) await clearHeldLines(id);
    if (e instanceof RangeError)
      throw new ApiError("validation_failed", `The share cannot be worked out: ${e.message}`);
    throw e;
  }
  const { payoutCents: payout, done } = await releaseUndisputed(
    inv.id,
    share.undisputed,
    `claim ${d.number} covers only part of the lot`,
  );
  if (!done && !claimedLines) {
    throw new ApiError(
      "conflict",
      `The undisputed share was already released${fresh.undisputed_released_at ? ` on ${fresh.undisputed_released_at.toISOString().slice(0, 10)}` : ""}: ${formatCents(payout)} to the consignor`,
      undefined,
      undefined,
      { state: d.state, payoutCents: payout },
    );
  }
  await markUndisputedReleased(id);
  await notice(d.buyer_id, undisputedReleasedNotice(d.number), casePath(d.id));
  return { payoutCents: payout, held: share.held, undisputed: share.undisputed };
}
