import { priceSeries, type PriceSeries } from "../../catalogue/price-history";
import { typeFamily } from "../../lots/type-family";
import { comparableSales } from "../lot-summary";
import { currentReferenceTable } from "../reference-table";

/** Price history for up to three type families (every condition sold), from our own sold lots. */
export async function priceHistoryForFamilies(families: readonly string[]): Promise<PriceSeries[]> {
  return priceSeries(await comparableSales(), [...new Set(families)].slice(0, 3)).filter((s) => s.sales > 0);
}

/** Price history of the family a designation belongs to (the reference page). */
export async function priceHistoryForDesignation(designation: string): Promise<PriceSeries[]> {
  return priceHistoryForFamilies([typeFamily(await currentReferenceTable(), designation).key]);
}
