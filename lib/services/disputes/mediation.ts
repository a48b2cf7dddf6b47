/** The mediator's side before a decision: taking a case, the weighing workspace, and the refund preview. */
import { ApiError } from "../../api/errors";
import type { Viewer } from "../../auth/guards";
import {
  buildManifest,
  claimsFromRulings,
  defaultLineValues,
  type LineValue,
  type Ruling,
} from "../../disputes/manifest";
import { weighItem, weighingSummary, type ItemWeighing } from "../../disputes/weigh";
import { settlePartialRefund, type SaleFigures } from "../../money/refunds";
import { lookupSourceCode } from "../../valves/source-code";
import type { RefundPreviewInput } from "../../validation/disputes";
import { settingsForInvoice } from "../house-settings";
import { registryEntries } from "../makers";
import { currentReferenceTable } from "../reference-table";
import { referenceProfiles } from "../shelf";
import { getCase } from "./cases";
import { loadCase, requireMediator, requireOfficial } from "./permissions";
import type { CaseView } from "./presenters";
import { asManifestItem } from "./shared";
import { takeDispute } from "./tables/disputes";
import { claimInvoice } from "./tables/invoices";
import { lotItems } from "./tables/lot-items";

/** A mediator takes a case from the queue; a second mediator is refused, the same one may retry. */
export async function takeCase(viewer: Viewer, id: string): Promise<void> {
  requireMediator(viewer, "Only mediators take cases");
  if (await takeDispute(id, viewer.id)) return;
  const { d } = await loadCase(viewer, id);
  if (d.state === "closed") throw new ApiError("conflict", "The case is closed");
  throw new ApiError("conflict", "Another mediator has already taken this case");
}

/**
 * The mediator's workspace: per claimed item, listing against report, ranked
 * and graded, with default line values for a refund. A page that has already
 * read the case passes it in.
 */
export async function workspace(viewer: Viewer, id: string, read?: CaseView) {
  const c = read ?? (await getCase(viewer, id));
  requireOfficial(c.role, true);
  // Testers differ by the tolerance of the claim's sale's frozen settings (the invoice's version, else the sale's).
  const [profiles, registry, frozen] = await Promise.all([
    referenceProfiles(),
    registryEntries(),
    settingsForInvoice(c.invoiceId),
  ]);
  const testerTolerancePct = frozen.claims.testerTolerancePct;
  const makerFor = (code: string | null | undefined) => {
    if (!code) return null;
    const r = lookupSourceCode(code, registry);
    return r.ok && r.found ? r.entries.map((e) => e.makerName).join(" / ") : null;
  };
  const weighings: (ItemWeighing & { itemId: string; tubes: number })[] = [];
  const table = await currentReferenceTable();
  for (const i of c.items) {
    const w = weighItem(
      table,
      c.reason,
      {
        position: i.position,
        designation: i.designation,
        quantity: i.quantity,
        labelBrand: i.listing.labelBrand,
        makerName: i.listing.makerName,
        makerBasis: i.listing.makerBasis,
        sourceCode: i.listing.sourceCode,
        dateCode: i.listing.dateCode,
        features: i.listing.features,
        vacuumLoss: i.listing.vacuumLoss,
        readings: i.listing.readings,
      },
      i.report,
      profiles,
      { listing: makerFor(i.listing.sourceCode), buyer: makerFor(i.report.sourceCode) },
      testerTolerancePct,
    );
    weighings.push({ ...w, itemId: i.id, tubes: i.tubes });
  }
  const all = await lotItems(c.lotId);
  const manifestItems = all.map(asManifestItem);
  return {
    weighings,
    testerTolerancePct,
    summary: weighingSummary(weighings),
    lines: all.map((i) => ({
      id: i.id,
      position: i.position,
      designation: i.designation,
      quantity: i.quantity,
      soldAsSet: i.sold_as_set,
      labelBrand: i.label_brand,
      makerName: i.maker_name,
    })),
    defaults: defaultLineValues(manifestItems, c.sale.hammerCents),
  };
}

/** The refund a partial-refund decision would pay, for the mediator's screen (no money moves). */
export async function refundPreview(viewer: Viewer, id: string, input: RefundPreviewInput) {
  const { d, role } = await loadCase(viewer, id);
  requireOfficial(role, false);
  const inv = await claimInvoice(d.invoice_id);
  const s = await previewRefund(d.lot_id, saleOf(inv), input.lines, input.rulings);
  return { ...s, items: undefined };
}

/** The sale figures refunds are worked out from. */
export const saleOf = (inv: {
  hammer_cents: number;
  premium_cents: number;
  commission_cents: number;
}): SaleFigures => ({
  hammerCents: inv.hammer_cents,
  premiumCents: inv.premium_cents,
  commissionCents: inv.commission_cents,
});

/** The refund arithmetic for a partial-refund decision (no money moves). */
export async function previewRefund(lotId: string, sale: SaleFigures, lines: LineValue[], rulings: Ruling[]) {
  const manifestItems = (await lotItems(lotId)).map(asManifestItem);
  try {
    const manifest = buildManifest(manifestItems, lines);
    const claims = claimsFromRulings(manifestItems, manifest, rulings);
    return settlePartialRefund(sale, manifest, claims);
  } catch (e) {
    if (e instanceof RangeError)
      throw new ApiError("validation_failed", `The refund cannot be worked out: ${e.message}`);
    throw e;
  }
}
