"use client";

import type { PanelMessage } from "@/lib/auction/standing";
import { formatCents } from "@/lib/money/cents";
import type { LotLive } from "@/lib/realtime/events";
import { When } from "@/components/time/When";
import { closedText } from "./standing-words";
import { formatLeft, useCountdown } from "./useCountdown";

const TONE = {
  lead: "border-sound-600 bg-sound-50",
  behind: "border-glow-500 bg-glow-50",
  neutral: "border-flash-200 bg-flash-50",
  done: "border-flash-300 bg-flash-100",
};

/** The dealer's standing on the lot, in one message. */
export function StandingBanner({ msg, words }: { msg: PanelMessage; words: { title: string; detail: string } }) {
  return (
    <div
      data-testid="standing"
      data-standing={msg.standing}
      className={`rounded-md border-l-4 px-3 py-2 ${TONE[msg.tone]}`}
      role="status"
    >
      <p className="font-semibold">{words.title}</p>
      {words.detail ? <p className="text-sm">{words.detail}</p> : null}
    </div>
  );
}

/** The price (or hammer), the count of bids, the time left (or the outcome) and whether the reserve is reached. */
export function LiveFigures({ live, flashSeq }: { live: LotLive; flashSeq: number | null }) {
  const left = useCountdown(live.closesAt);
  const open = live.phase === "open";
  return (
    <dl className="grid grid-cols-2 gap-3 sm:grid-cols-4">
      <div>
        <dt className="text-xs text-flash-600">
          {open ? "Price now" : live.phase === "sold" ? "Hammer price" : "Last price"}
        </dt>
        <dd
          data-testid="live-price"
          className={`code text-3xl font-semibold transition-colors duration-700 ${flashSeq ? "text-glow-600" : ""}`}
        >
          {live.bidCount
            ? formatCents(live.phase === "sold" ? (live.hammerCents ?? live.priceCents) : live.priceCents)
            : "Opens"}
        </dd>
      </div>
      <div>
        <dt className="text-xs text-flash-600">Bids placed</dt>
        <dd data-testid="live-bids" className="text-2xl font-semibold">
          {live.bidCount}
        </dd>
      </div>
      <div>
        <dt className="text-xs text-flash-600">{open ? "Closes in" : "Outcome"}</dt>
        <dd
          data-testid="live-left"
          className={`text-2xl font-semibold ${open && left != null && left < 120_000 ? "text-glow-700" : ""}`}
        >
          {open ? (left == null ? "…" : formatLeft(left)) : closedText(live.phase, live.hammerCents)}
        </dd>
        <p className="text-xs text-flash-600">
          {open ? "at " : "closed "}
          <When iso={live.closesAt} style="time" />
        </p>
      </div>
      <div>
        <dt className="text-xs text-flash-600">Reserve</dt>
        <dd className="text-lg font-semibold">
          {live.bidCount === 0 ? "—" : live.reserveMet ? "Reached" : "Not yet reached"}
        </dd>
      </div>
    </dl>
  );
}

/** Whether the live link is up, in words beside the dot. */
export function LinkState({ connected }: { connected: boolean }) {
  return (
    <p className="text-xs text-flash-600" data-testid="live-link" data-connected={connected}>
      <span
        aria-hidden="true"
        className={`mr-1 inline-block h-2 w-2 rounded-full ${connected ? "bg-glow-500" : "bg-flash-300"}`}
      />
      {connected ? "Following live" : "Link lost: figures refresh when it is back"}
    </p>
  );
}

type CeilingFormProps = {
  minimumCents: number;
  amount: string;
  setAmount: (a: string) => void;
  busy: boolean;
  onBid: (e: React.FormEvent) => void;
};

/** The dealer's ceiling: pinned to the foot of a phone's screen, in line on a wider one. */
export function CeilingForm({ minimumCents, amount, setAmount, busy, onBid }: CeilingFormProps) {
  return (
    <form
      onSubmit={onBid}
      aria-label="Set your ceiling"
      className="fixed inset-x-0 bottom-0 z-20 flex flex-wrap items-end gap-2 border-t border-flash-200 bg-white p-3 shadow-lg sm:static sm:border-0 sm:p-0 sm:shadow-none"
    >
      <label className="min-w-0 flex-1 text-sm sm:flex-none">
        <span className="label">Your ceiling ($)</span>
        <input
          className="input code mt-1 w-full sm:w-40"
          inputMode="decimal"
          value={amount}
          onChange={(e) => setAmount(e.target.value)}
          placeholder={(minimumCents / 100).toFixed(2)}
          aria-describedby="min-hint"
        />
      </label>
      <button type="submit" className="btn-primary min-h-11" disabled={busy}>
        {busy ? "Sending…" : "Bid"}
      </button>
      <span id="min-hint" className="w-full pb-1 text-xs text-flash-600 sm:w-auto sm:pb-2 sm:text-sm">
        At least {formatCents(minimumCents)}. The house raises your bid in steps only when someone bids against you,
        never past your ceiling.
      </span>
    </form>
  );
}
