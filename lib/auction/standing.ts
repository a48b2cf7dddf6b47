/**
 * A dealer's standing on one lot, as a small state machine ([SUG] our own
 * product rule). The live panel shows exactly one message, derived from the
 * latest public lot state plus what the dealer knows privately (their own
 * maximum, whether they lead) and their own last action. Pure: no framework.
 */
export type Standing = "not-bid" | "leading" | "outbid" | "won" | "lost" | "unsold" | "own-lot";

export type LotPhase = "open" | "sold" | "unsold" | "withdrawn";

/** What the panel knows: the lot's phase and the viewer's private facts. */
export interface StandingInput {
  phase: LotPhase;
  ownLot: boolean;
  /** The viewer has at least one standing (not retracted) bid. */
  bidding: boolean;
  /** The viewer is the current leader (for a sold lot: the buyer). */
  leading: boolean;
}

/** The standing for the lot's current state; closed phases override anything live. */
export function standingOf(s: StandingInput): Standing {
  if (s.ownLot) return "own-lot";
  if (s.phase === "sold") return !s.bidding ? "not-bid" : s.leading ? "won" : "lost";
  if (s.phase === "unsold" || s.phase === "withdrawn") return !s.bidding ? "not-bid" : "unsold";
  if (!s.bidding) return "not-bid";
  return s.leading ? "leading" : "outbid";
}

/** Whether a bid form belongs on the panel for this standing and phase. */
export function canBidIn(phase: LotPhase, standing: Standing): boolean {
  return phase === "open" && standing !== "own-lot";
}

/** The dealer's own last action, as the bid answer told it (stays only while it still agrees with the lot). */
export type LastAction =
  | {
      kind: "bid";
      outcome: "first-bid" | "new-leader" | "outbid-by-proxy" | "max-raised";
      seq: number;
      maxCents: number;
    }
  | { kind: "refused"; seq: number; message: string };

/**
 * One message for the panel. The last action's wording is kept only while
 * the lot has not moved past it (same seq) and it agrees with the standing;
 * otherwise the standing speaks. This is what stops "you lead" from sitting
 * under "someone bid higher".
 */
export type PanelMessage = { standing: Standing; tone: "lead" | "behind" | "neutral" | "done"; key: string };

export function panelMessage(
  s: StandingInput & { seq: number },
  last: LastAction | null,
): PanelMessage & { last: LastAction | null } {
  const standing = standingOf(s);
  const tone: PanelMessage["tone"] =
    standing === "leading" || standing === "won"
      ? "lead"
      : standing === "outbid" || standing === "lost"
        ? "behind"
        : standing === "unsold"
          ? "done"
          : "neutral";
  let keep: LastAction | null = null;
  if (last && s.phase === "open" && last.seq === s.seq) {
    if (last.kind === "refused") keep = last;
    else if (last.outcome === "outbid-by-proxy" ? standing === "outbid" : standing === "leading") keep = last;
  }
  const key = keep ? (keep.kind === "refused" ? "refused" : keep.outcome) : standing;
  return { standing, tone, key, last: keep };
}
