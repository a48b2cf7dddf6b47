import type { ProxyState } from "../auction/proxy";
import type { SalePhase } from "../../models/Sale";

/**
 * The typed face of the `sale_lots` table for raw queries (the SaleLot model
 * is its ORM face): one lot's place in a sale with its live bidding state.
 */
export type SaleLotRow = {
  id: string;
  sale_id: string;
  lot_id: string;
  position: number;
  consignor_id: string;
  phase: SalePhase;
  opening_cents: number;
  closes_at: Date;
  original_close_at: Date;
  extension_count: number;
  seq: number;
  price_cents: number;
  bid_count: number;
  leader_id: string | null;
  reserve_met: boolean;
  state: ProxyState;
  closed_at: Date | null;
  buyer_id: string | null;
  hammer_cents: number | null;
  unsold_reason: string | null;
  created_at: Date;
  updated_at: Date;
};

/** A select list of some sale-lot columns, optionally qualified by a table alias. */
export function saleLotColumns<K extends keyof SaleLotRow>(columns: readonly K[], alias?: string): string {
  return columns.map((c) => (alias ? `${alias}.${c}` : c)).join(", ");
}
