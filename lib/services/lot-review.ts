import type { Viewer } from "../auth/guards";
import { ApiError } from "../api/errors";
import { env } from "../config/env";
import { sendMail } from "../mail/mailer";
import { formatCents } from "../money/cents";
import type { AmendmentInput, ReviewDecision } from "../validation/lots";
import { needsExtraReview } from "../disputes/rules";
import { currentSettings } from "./house-settings";
import { consignorRecord } from "./track-record";
import { db, Lot, LotEvent, LotItem, User } from "../../models";
import type { LotState } from "../../models/Lot";
import { lotChanged } from "./catalogue/events";
import { assertConsignorCanEdit } from "./lot-access";
import { presentLot, type LotView } from "./lots";
import { notify } from "./notices";

const TARGET: Record<ReviewDecision["action"], LotState> = {
  "request-changes": "needs-changes",
  approve: "approved",
  decline: "declined",
};

async function mailConsignor(lot: Lot, subject: string, body: string): Promise<void> {
  await notify(lot.consignorId, `${subject}: ${lot.title}`, `/consignor/lots/${lot.id}`).catch((e: Error) =>
    console.error("[notice] lot notice failed", e.message),
  );
  const consignor = await User.findByPk(lot.consignorId, { attributes: ["email", "displayName"] });
  if (!consignor) return;
  await sendMail({
    to: consignor.email,
    subject,
    text: `Hello ${consignor.displayName},\n\n${body}\n\nOpen the lot: ${env().NEXTAUTH_URL}/consignor/lots/${lot.id}\n\nGetterline Exchange`,
  }).catch((e: Error) => console.error("[mail] lot notice failed", e.message));
}

/** The consignor hands the lot to the house for review (it must hold at least one item). */
export async function submitLot(viewer: Viewer, lotId: string): Promise<LotView> {
  const s = db();
  return s.transaction(async (t) => {
    const lot = await Lot.findByPk(lotId, { lock: t.LOCK.UPDATE, transaction: t });
    if (lot && lot.consignorId === viewer.id && lot.state === "in-review") return presentLot(lot, viewer); // a retried submit
    assertConsignorCanEdit(viewer, lot);
    const items = await LotItem.count({ where: { lotId }, transaction: t });
    if (items === 0) throw new ApiError("conflict", "Add at least one item before submitting the lot");
    const resubmission = lot!.state === "needs-changes";
    // A consignor with repeated upheld misattribution claims has their next lots reviewed more closely.
    const record = await consignorRecord(viewer.id);
    const { settings } = await currentSettings(t); // the threshold in force now
    const extra =
      lot!.extraReview || needsExtraReview(record.upheldMisattributionClaims, settings.claims.extraReviewAfterUpheld);
    await lot!.update({ state: "in-review", submittedAt: new Date(), extraReview: extra }, { transaction: t });
    const note = extra
      ? `Extra review: ${record.upheldMisattributionClaims} upheld misattribution claim(s) on earlier lots`
      : "";
    await LotEvent.create(
      {
        lotId,
        actorId: viewer.id,
        kind: "submitted",
        comment: [resubmission ? "Resubmitted after changes" : "", note].filter(Boolean).join(". "),
      },
      { transaction: t },
    );
    return presentLot(lot!, viewer);
  });
}

/**
 * The house decides on a lot in review: ask for changes (the consignor is
 * e-mailed the comment), approve with an estimate and an agreed reserve (the
 * lot locks), or decline. Repeating the same decision changes nothing.
 */
export async function decideLot(admin: Viewer, lotId: string, d: ReviewDecision): Promise<LotView> {
  const s = db();
  const { lot, changed } = await s.transaction(async (t) => {
    const lot = await Lot.findByPk(lotId, { lock: t.LOCK.UPDATE, transaction: t });
    if (!lot) throw new ApiError("not_found", "No such lot");
    if (lot.state === TARGET[d.action]) return { lot, changed: false };
    if (lot.state !== "in-review") throw new ApiError("conflict", `The lot is ${lot.state}, not in review`);
    const now = new Date();
    if (d.action === "approve") {
      if (lot.extraReview && d.comment.trim().length < 20) {
        throw new ApiError(
          "validation_failed",
          "This lot is under extra review: say what you checked of its attributions before approving",
          { comment: "Record the attribution checks (at least 20 characters)" },
        );
      }
      await lot.update(
        {
          state: "approved",
          estimateLowCents: d.estimateLowCents,
          estimateHighCents: d.estimateHighCents,
          reserveCents: d.reserveCents,
          reserveAgreedAt: now,
          approvedAt: now,
          approvedBy: admin.id,
        },
        { transaction: t },
      );
    } else {
      await lot.update({ state: TARGET[d.action] }, { transaction: t });
    }
    const details =
      d.action === "approve"
        ? { estimateLowCents: d.estimateLowCents, estimateHighCents: d.estimateHighCents, reserveAgreed: true }
        : {};
    await LotEvent.create(
      {
        lotId,
        actorId: admin.id,
        kind:
          TARGET[d.action] === "needs-changes" ? "changes-requested" : (TARGET[d.action] as "approved" | "declined"),
        comment: d.comment,
        details,
      },
      { transaction: t },
    );
    return { lot, changed: true };
  });
  if (changed) {
    if (d.action === "request-changes") {
      await mailConsignor(
        lot,
        `Changes asked on your lot "${lot.title}"`,
        `The house reviewed your lot and asks for changes:\n\n${d.comment}\n\nMake them and submit the lot again.`,
      );
    } else if (d.action === "approve") {
      await lotChanged(lot.id, "approved");
      await mailConsignor(
        lot,
        `Your lot "${lot.title}" is approved`,
        `The house approved your lot with an estimate of ${formatCents(d.estimateLowCents)}–${formatCents(d.estimateHighCents)} and the reserve you agreed (${formatCents(d.reserveCents)}).${d.comment ? `\n\n${d.comment}` : ""}`,
      );
    } else {
      await mailConsignor(lot, `Your lot "${lot.title}" was declined`, `The house declined your lot:\n\n${d.comment}`);
    }
  }
  return presentLot(lot, admin);
}

/** A correction after approval, applied and recorded as a dated amendment everyone who sees the lot can read. */
export async function amendLot(admin: Viewer, lotId: string, a: AmendmentInput): Promise<void> {
  const s = db();
  await s.transaction(async (t) => {
    const lot = await Lot.findByPk(lotId, { lock: t.LOCK.UPDATE, transaction: t });
    if (!lot) throw new ApiError("not_found", "No such lot");
    if (lot.state !== "approved")
      throw new ApiError("conflict", "Only approved lots take amendments; others are edited directly");
    const details: Record<string, unknown> = {};
    if (a.itemId) {
      const item = await LotItem.findOne({ where: { id: a.itemId, lotId }, transaction: t });
      if (!item) throw new ApiError("not_found", "No such item in this lot");
      const patch: Partial<Pick<LotItem, "quantity" | "vacuumLoss" | "condition" | "notes">> = {};
      if (a.quantity !== undefined) patch.quantity = a.quantity;
      if (a.vacuumLoss !== undefined) patch.vacuumLoss = a.vacuumLoss;
      if (a.condition !== undefined) patch.condition = a.condition;
      if (a.notes !== undefined) patch.notes = a.notes;
      details.itemId = item.id;
      details.designation = item.designation;
      details.before = Object.fromEntries(Object.keys(patch).map((k) => [k, item.get(k as keyof typeof patch)]));
      details.after = patch;
      await item.update(patch, { transaction: t });
    }
    await LotEvent.create(
      { lotId, actorId: admin.id, kind: "amended", comment: a.description, details },
      { transaction: t },
    );
  });
  await lotChanged(lotId, "amended");
}
