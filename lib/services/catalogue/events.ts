import { requestWantListMatch } from "../want-list-matching";
import { refreshCatalogueEntry } from "./entries";
import { ageFacetCounts } from "./facets";

/** What happened to a lot that the catalogue should follow. */
export type LotChange = "approved" | "amended" | "scheduled" | "closed" | "photos";

/**
 * Keep the public catalogue in step with a lot: its entry is rewritten at once (a few queries), and a lot that
 * became visible or was offered in a sale is matched against want lists by a durable job. Failures are logged,
 * never thrown into the action that changed the lot; `npm run db:seed` (or refreshAllCatalogueEntries) repairs.
 */
export async function lotChanged(lotId: string, change: LotChange): Promise<void> {
  await refreshCatalogueEntry(lotId).catch((e: Error) =>
    console.error(`[catalogue] refresh of ${lotId} failed`, e.message),
  );
  ageFacetCounts();
  if (change === "approved" || change === "scheduled") {
    await requestWantListMatch(lotId, change).catch((e: Error) =>
      console.error(`[want-lists] could not queue ${lotId}`, e.message),
    );
  }
}
