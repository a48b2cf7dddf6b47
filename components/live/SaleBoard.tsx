"use client";

import Link from "next/link";
import { useQuery, useQueryClient } from "@tanstack/react-query";
import { useState } from "react";
import { apiFetch } from "@/lib/client/api";
import { standingOf, type Standing } from "@/lib/auction/standing";
import { formatCents } from "@/lib/money/cents";
import { saleRoom, type LotLive } from "@/lib/realtime/events";
import { STANDING_SHORT } from "./standing-words";
import { TimeLeft } from "./TimeLeft";
import { useLotEvents } from "./useLotEvents";
import { useNow } from "@/components/time/useViewerZone";

type Row = LotLive & { lotId: string; title: string; position: number; consignor: string };
type You = { paddle: number | null; ceilings: Record<string, number>; watched: string[] };
type Data = { sale: { id: string; title: string; startsAt: string; softCloseSeconds: number }; lots: Row[]; you: You };

const FILTERS = [
  { key: "all", label: "All lots" },
  { key: "soon", label: "Closing within 15 min" },
  { key: "leading", label: "I hold" },
  { key: "outbid", label: "I'm behind" },
  { key: "watched", label: "Followed" },
] as const;
type Filter = (typeof FILTERS)[number]["key"];

function standingFor(l: Row, you: You): Standing {
  const bidding = you.ceilings[l.saleLotId] != null;
  return standingOf({
    phase: l.phase,
    ownLot: false,
    bidding,
    leading: bidding && you.paddle != null && l.leaderPaddle === you.paddle,
  });
}

/**
 * A sale's lots with live prices and the dealer's own standing. Updates
 * arrive over the sale's room in seq order per lot; a gap waits briefly, then refetches.
 * Below 640 px each lot is a card led by price, time left and standing.
 */
export function SaleBoard({ initial }: { initial: Data }) {
  const qc = useQueryClient();
  const key = ["sale", initial.sale.id];
  const { data } = useQuery({
    queryKey: key,
    queryFn: () => apiFetch<Data>(`/api/sales/${initial.sale.id}`),
    initialData: initial,
  });
  const [filter, setFilter] = useState<Filter>("all");
  const now = useNow();
  useLotEvents(
    saleRoom(initial.sale.id),
    (lotId) => qc.getQueryData<Data>(key)?.lots.find((l) => l.saleLotId === lotId)?.seq ?? null,
    (p) => {
      qc.setQueryData<Data>(
        key,
        (old) =>
          old && {
            ...old,
            lots: old.lots.map((l) => (l.saleLotId === p.saleLotId && p.seq > l.seq ? { ...l, ...p } : l)),
          },
      );
    },
    () => void qc.invalidateQueries({ queryKey: key }),
  );

  const rows = data.lots
    .map((l) => ({ ...l, standing: standingFor(l, data.you) }))
    .filter((l) => {
      if (filter === "soon") return l.phase === "open" && now != null && Date.parse(l.closesAt) - now <= 15 * 60_000;
      if (filter === "leading") return l.standing === "leading";
      if (filter === "outbid") return l.standing === "outbid";
      if (filter === "watched") return data.you.watched.includes(l.saleLotId);
      return true;
    });
  const href = (l: Row) => `/sales/${l.saleId}/lots/${l.saleLotId}`;
  return (
    <div className="space-y-3">
      <div role="group" aria-label="Show" className="flex flex-wrap gap-2 text-sm">
        {FILTERS.map((f) => (
          <button
            key={f.key}
            type="button"
            aria-pressed={filter === f.key}
            onClick={() => setFilter(f.key)}
            className={`rounded-full border px-3 py-1 ${filter === f.key ? "border-glow-600 bg-glow-50 font-medium text-glow-800" : "border-flash-300 bg-white text-flash-700"}`}
          >
            {f.label}
          </button>
        ))}
      </div>
      <ul className="space-y-2 sm:hidden" aria-label="Lots">
        {rows.map((l) => (
          <li key={l.saleLotId} className="card space-y-1 p-3" data-testid={`card-${l.saleLotId}`}>
            <Link href={href(l)} className="font-medium underline underline-offset-2">
              {l.position}. {l.title}
            </Link>
            <div className="flex items-baseline justify-between gap-2">
              <span className="code text-lg font-semibold">{l.bidCount ? formatCents(l.priceCents) : "No bids"}</span>
              <span data-testid={`left-${l.saleLotId}`}>
                <TimeLeft iso={l.closesAt} phase={l.phase} />
              </span>
            </div>
            <p className="flex justify-between text-xs text-flash-600">
              <span>
                {l.bidCount} {l.bidCount === 1 ? "bid" : "bids"} ·{" "}
                {l.bidCount === 0 ? "reserve —" : l.reserveMet ? "reserve reached" : "reserve not reached"}
              </span>
              <span className="font-medium text-flash-800">{STANDING_SHORT[l.standing]}</span>
            </p>
          </li>
        ))}
      </ul>
      <div className="hidden overflow-x-auto rounded-lg border border-flash-200 bg-white sm:block">
        <table className="min-w-full text-sm">
          <thead className="bg-flash-100 text-left text-flash-700">
            <tr>
              {["#", "Lot", "Consignor", "Price", "Bids", "Leader", "Reserve", "Time left", "My standing"].map((h) => (
                <th key={h} scope="col" className="px-3 py-2 font-medium">
                  {h}
                </th>
              ))}
            </tr>
          </thead>
          <tbody>
            {rows.map((l) => (
              <tr key={l.saleLotId} className="border-t border-flash-200">
                <td className="px-3 py-2">{l.position}</td>
                <td className="px-3 py-2">
                  <Link href={href(l)} className="font-medium underline underline-offset-2">
                    {l.title}
                  </Link>
                </td>
                <td className="px-3 py-2">{l.consignor}</td>
                <td className="code px-3 py-2" data-testid={`price-${l.saleLotId}`}>
                  {l.bidCount ? formatCents(l.priceCents) : "—"}
                </td>
                <td className="px-3 py-2">{l.bidCount}</td>
                <td className="px-3 py-2">{l.leaderPaddle ? `Paddle ${l.leaderPaddle}` : "—"}</td>
                <td className="px-3 py-2">{l.bidCount === 0 ? "" : l.reserveMet ? "Reached" : "Not reached"}</td>
                <td className="px-3 py-2">
                  <TimeLeft iso={l.closesAt} phase={l.phase} />
                </td>
                <td className="px-3 py-2" data-testid={`standing-${l.saleLotId}`}>
                  {STANDING_SHORT[l.standing]}
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      {rows.length === 0 ? <p className="text-sm text-flash-600">No lots match this filter.</p> : null}
    </div>
  );
}
