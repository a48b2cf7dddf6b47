import type { Viewer } from "../../auth/guards";
import type { LotSheetDoc } from "../../documents/lot-sheet";
import { getLot } from "../lots";
import { summaryFor } from "../lot-summary";
import { paperCautions } from "./cautions";

/**
 * A lot sheet for anyone who may see the lot's page (getLot decides: the public for approved lots, the
 * consignor and the house always). No reserve and no consignor name are printed.
 */
export async function lotSheetDocument(viewer: Viewer | null, lotId: string): Promise<LotSheetDoc> {
  const data = await getLot(viewer, lotId);
  const { summary } = await summaryFor(data.items);
  const l = data.lot;
  return {
    lotId: l.id,
    title: l.title,
    provenance: l.provenance ?? "",
    shippingOrigin: l.shippingOrigin ?? "",
    preparedAt: new Date().toISOString(),
    estimate:
      l.estimateLowCents != null
        ? { lowCents: l.estimateLowCents, highCents: l.estimateHighCents ?? l.estimateLowCents }
        : null,
    tubeCount: summary.tubeCount,
    items: data.items.map((i) => ({
      designation: i.designation || i.designationTyped,
      quantity: i.quantity,
      condition: i.condition,
      basis: i.makerBasis,
      maker: i.makerName,
      codes: [i.sourceCode, i.dateCode].filter(Boolean).join(" / "),
      readings: i.readings.length,
      vacuumLoss: i.vacuumLoss,
      checkType: !i.designationKnown,
    })),
    families: summary.families.map((f) => ({
      label: f.label,
      tubes: f.tubes,
      tested: f.tests.tested,
      strong: f.tests.strong,
      good: f.tests.good,
      fair: f.tests.fair,
      weak: f.tests.weak,
      reject: f.tests.reject,
      pairs: f.pairs,
      quads: f.quads,
    })),
    vacuumLossTubes: summary.vacuumLoss,
    testedNotGraded: summary.tests.testedNotGraded,
    attribution: summary.attribution,
    cautions: paperCautions(summary.hazards),
  };
}
