import { priceSeries, type PriceSeries } from "../../catalogue/price-history";
import { comparableSales } from "../lot-summary";

/** Price history for up to three type families (every condition sold), from our own sold lots. */
export async function priceHistoryForFamilies(families: readonly string[]): Promise<PriceSeries[]> {
  return priceSeries(await comparableSales(), [...new Set(families)].slice(0, 3)).filter((s) => s.sales > 0);
}
