"use client";

import Link from "next/link";
import { canBidIn, panelMessage, type LastAction } from "@/lib/auction/standing";
import { BidHistory } from "./BidHistory";
import { CeilingForm, LinkState, LiveFigures, StandingBanner } from "./LivePanels";
import { LotFacts } from "./LotFacts";
import { standingText } from "./standing-words";
import { useCeilingBid } from "./useCeilingBid";
import { useLiveLotState, type LiveLotData } from "./useLiveLotState";

/** The panel's one message and its words, from the latest lot state and the dealer's own last action. */
function standingOf(data: LiveLotData, last: LastAction | null) {
  const live = data.live;
  // Leading follows the latest public state at once when the dealer's paddle is known.
  const leading =
    data.you.paddle != null && live.leaderPaddle != null ? live.leaderPaddle === data.you.paddle : data.you.leading;
  const msg = panelMessage(
    { phase: live.phase, ownLot: data.you.ownLot, bidding: data.you.bidding, leading, seq: live.seq },
    last,
  );
  const words = standingText(msg, {
    priceCents: live.priceCents,
    hammerCents: live.hammerCents,
    maxCents: data.you.maxCents,
    leaderPaddle: live.leaderPaddle,
  });
  return { msg, words };
}

type Props = { initial: LiveLotData; canBid: boolean; lotHref: string };

/**
 * One lot in a live sale. The panel shows one message at a time, derived
 * from the latest lot state and the dealer's own last action (see
 * lib/auction/standing). Broadcasts apply in seq order; a gap waits briefly, then refetches.
 */
export function LiveLot({ initial, canBid, lotHref }: Props) {
  const { data, flashSeq, announce, connected, refetch, toggleWatch } = useLiveLotState(initial);
  const live = data.live;
  const ceiling = useCeilingBid({ id: live.saleLotId, seq: live.seq, refetch });
  const { msg, words } = standingOf(data, ceiling.last);
  const open = live.phase === "open";
  const showForm = canBid && canBidIn(live.phase, msg.standing);
  return (
    <div className="grid gap-5 pb-28 sm:pb-0 lg:grid-cols-[2fr_1fr]">
      <section aria-labelledby="live-h" className="card space-y-4">
        <h2 id="live-h" className="sr-only">
          Bidding
        </h2>
        <StandingBanner msg={msg} words={words} />
        <LiveFigures live={live} flashSeq={flashSeq} />
        <LinkState connected={connected} />
        <p aria-live="polite" className="min-h-5 text-sm font-medium text-glow-700">
          {announce}
        </p>
        {showForm ? (
          <CeilingForm
            minimumCents={live.minimumCents}
            amount={ceiling.amount}
            setAmount={ceiling.setAmount}
            busy={ceiling.busy}
            onBid={ceiling.bid}
          />
        ) : null}
        <div className="flex flex-wrap gap-4 text-sm">
          <Link href={lotHref} className="underline">
            Read the lot&apos;s evidence
          </Link>
          {canBid && open ? (
            <button type="button" className="underline" onClick={toggleWatch}>
              {data.you.watching ? "Stop following on my desk" : "Follow on my desk"}
            </button>
          ) : null}
        </div>
        <LotFacts lot={data.lot} />
      </section>
      <BidHistory rows={data.history} flashSeq={flashSeq} />
    </div>
  );
}
