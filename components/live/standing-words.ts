import type { LastAction, PanelMessage, Standing } from "@/lib/auction/standing";
import { formatCents } from "@/lib/money/cents";

/** Figures the words need. */
export type WordsInput = {
  priceCents: number;
  hammerCents: number | null;
  maxCents: number | null;
  leaderPaddle: number | null;
};

/**
 * Getterline's own words for each standing (one message at a time). A
 * "ceiling" is the most a dealer will pay: the house bids for them in steps,
 * only as far as needed to stay ahead.
 */
export function standingText(
  m: PanelMessage & { last: LastAction | null },
  f: WordsInput,
): { title: string; detail: string } {
  const price = formatCents(f.priceCents);
  const ceiling = f.maxCents != null ? formatCents(f.maxCents) : "—";
  const last = m.last;
  if (last?.kind === "refused") return { title: "Bid not taken", detail: last.message };
  if (last?.kind === "bid") {
    const c = formatCents(last.maxCents);
    if (last.outcome === "max-raised")
      return {
        title: "Your ceiling raised",
        detail: `Now ${c}. The price stays at ${price}; only you see this change.`,
      };
    if (last.outcome === "outbid-by-proxy")
      return {
        title: "Taken, but not ahead",
        detail: `Another dealer's ceiling is higher. Your ${c} moved the price to ${price}.`,
      };
    return { title: "You hold this lot", detail: `At ${price}, with your private ceiling of ${c}.` };
  }
  switch (m.standing) {
    case "own-lot":
      return { title: "Your own lot", detail: "You can follow it here, but not bid on it." };
    case "not-bid":
      return { title: "No bid from you", detail: "" };
    case "leading":
      return { title: "You hold this lot", detail: `At ${price}, with your private ceiling of ${ceiling}.` };
    case "outbid":
      return {
        title: "Another dealer is ahead",
        detail: `Their ceiling passed yours (${ceiling}). Raise it to take the lead back.`,
      };
    case "won":
      return {
        title: "Yours",
        detail: `Hammer price ${formatCents(f.hammerCents ?? f.priceCents)}. The invoice is on your dealer desk.`,
      };
    case "lost":
      return {
        title: "Closed: not yours",
        detail: `Sold for ${formatCents(f.hammerCents ?? f.priceCents)}${f.leaderPaddle ? ` to paddle ${f.leaderPaddle}` : ""}. Your ceiling was ${ceiling}.`,
      };
    case "unsold":
      return {
        title: "Closed without a sale",
        detail: "The reserve was not reached. The consignor may offer it again in a later sale.",
      };
  }
}

/** The outcome of a closed lot in one short phrase, for whoever watches. */
export function closedText(phase: string, hammerCents: number | null): string {
  if (phase === "sold") return `Sold for ${formatCents(hammerCents ?? 0)}`;
  if (phase === "withdrawn") return "Withdrawn";
  return "Closed unsold";
}

/** Our words for a dealer's standing in a list. */
export const STANDING_SHORT: Record<Standing, string> = {
  "not-bid": "—",
  leading: "You hold it",
  outbid: "Behind",
  won: "Yours",
  lost: "Not yours",
  unsold: "Unsold",
  "own-lot": "Your lot",
};
