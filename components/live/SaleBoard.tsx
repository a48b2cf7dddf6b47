"use client";

import Link from "next/link";
import { useQuery, useQueryClient } from "@tanstack/react-query";
import { useEffect } from "react";
import { apiFetch } from "@/lib/client/api";
import { formatCents } from "@/lib/money/cents";
import { saleRoom, type LotLive } from "@/lib/realtime/events";
import { formatLeft, useCountdown } from "./useCountdown";
import { joinRooms, liveSocket } from "./socket";

type Row = LotLive & { lotId: string; title: string; position: number; consignor: string };
type Data = { sale: { id: string; title: string; startsAt: string; softCloseSeconds: number }; lots: Row[] };

function Left({ iso, phase }: { iso: string; phase: string }) {
  const ms = useCountdown(iso);
  if (phase !== "open") return <span>{phase === "sold" ? "Sold" : phase === "unsold" ? "Unsold" : "Withdrawn"}</span>;
  return <span className={ms < 120_000 ? "font-semibold text-glow-700" : ""}>{formatLeft(ms)}</span>;
}

/**
 * A sale's lots with live prices. Updates arrive over the sale's socket room
 * and are applied only in sequence order; a gap or a reconnect refetches.
 */
export function SaleBoard({ initial }: { initial: Data }) {
  const qc = useQueryClient();
  const key = ["sale", initial.sale.id];
  const { data } = useQuery({ queryKey: key, queryFn: () => apiFetch<Data>(`/api/sales/${initial.sale.id}`), initialData: initial });
  useEffect(() => {
    const refetch = () => void qc.invalidateQueries({ queryKey: key });
    const leave = joinRooms([saleRoom(initial.sale.id)], refetch);
    const apply = (p: LotLive) => {
      qc.setQueryData<Data>(key, (old) => {
        if (!old) return old;
        const cur = old.lots.find((l) => l.saleLotId === p.saleLotId);
        if (!cur || p.seq <= cur.seq) return old;
        if (p.seq > cur.seq + 1) { refetch(); return old; }
        return { ...old, lots: old.lots.map((l) => (l.saleLotId === p.saleLotId ? { ...l, ...p } : l)) };
      });
    };
    const s = liveSocket();
    s.on("lot.bid", apply);
    s.on("lot.closed", apply);
    return () => { leave(); s.off("lot.bid", apply); s.off("lot.closed", apply); };
  }, [initial.sale.id]); // eslint-disable-line react-hooks/exhaustive-deps

  return (
    <div className="overflow-x-auto rounded-lg border border-flash-200 bg-white">
      <table className="min-w-full text-sm">
        <thead className="bg-flash-100 text-left text-flash-700">
          <tr>{["#", "Lot", "Consignor", "Price", "Bids", "Leader", "Reserve", "Time left"].map((h) => <th key={h} scope="col" className="px-3 py-2 font-medium">{h}</th>)}</tr>
        </thead>
        <tbody>
          {data.lots.map((l) => (
            <tr key={l.saleLotId} className="border-t border-flash-200">
              <td className="px-3 py-2">{l.position}</td>
              <td className="px-3 py-2"><Link href={`/sales/${l.saleId}/lots/${l.saleLotId}`} className="font-medium underline underline-offset-2">{l.title}</Link></td>
              <td className="px-3 py-2">{l.consignor}</td>
              <td className="code px-3 py-2" data-testid={`price-${l.saleLotId}`}>{l.bidCount ? formatCents(l.priceCents) : "—"}</td>
              <td className="px-3 py-2">{l.bidCount}</td>
              <td className="px-3 py-2">{l.leaderPaddle ? `Paddle ${l.leaderPaddle}` : "—"}</td>
              <td className="px-3 py-2">{l.bidCount === 0 ? "" : l.reserveMet ? "Met" : "Not met"}</td>
              <td className="px-3 py-2"><Left iso={l.closesAt} phase={l.phase} /></td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
