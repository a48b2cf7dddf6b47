"use client";

import Link from "next/link";
import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { useEffect, useState } from "react";
import { apiFetch } from "@/lib/client/api";
import { liveSocket } from "./socket";
import { When } from "@/components/time/When";

type Notice = { id: string; text: string; href: string | null; read: boolean; at: string };

/** In-app notices (outbid, won), pushed live to the signed-in person's own room. */
export function NoticeBell() {
  const qc = useQueryClient();
  const [open, setOpen] = useState(false);
  const [flash, setFlash] = useState<string | null>(null);
  const { data } = useQuery({ queryKey: ["notices"], queryFn: () => apiFetch<{ notices: Notice[] }>("/api/notices") });
  useEffect(() => {
    const s = liveSocket();
    const on = (n: { text: string }) => {
      setFlash(n.text);
      void qc.invalidateQueries({ queryKey: ["notices"] });
      setTimeout(() => setFlash(null), 8000);
    };
    s.on("notice.created", on);
    return () => {
      s.off("notice.created", on);
    };
  }, [qc]);
  const markRead = useMutation({
    mutationFn: () => apiFetch("/api/notices/read", { method: "POST" }),
    onSuccess: () => void qc.invalidateQueries({ queryKey: ["notices"] }),
  });
  const unread = data?.notices.filter((n) => !n.read).length ?? 0;
  return (
    <div className="relative">
      <button
        type="button"
        className="text-sm text-flash-700 underline-offset-4 hover:underline"
        aria-expanded={open}
        onClick={() => {
          setOpen(!open);
          if (!open && unread) markRead.mutate();
        }}
      >
        Notices
        {unread ? <span className="ml-1 rounded-full bg-glow-600 px-1.5 text-xs text-white">{unread}</span> : null}
      </button>
      {flash ? (
        <p
          role="status"
          className="absolute right-0 top-7 z-20 w-72 rounded-md border border-glow-400 bg-glow-50 p-2 text-sm shadow"
        >
          {flash}
        </p>
      ) : null}
      {open ? (
        <div className="absolute right-0 top-7 z-10 w-80 rounded-md border border-flash-200 bg-white p-2 text-sm shadow">
          {data?.notices.length ? (
            <ul className="max-h-80 space-y-1 overflow-auto">
              {data.notices.map((n) => (
                <li key={n.id} className="border-b border-flash-100 pb-1">
                  {n.href ? (
                    <Link href={n.href} className="underline">
                      {n.text}
                    </Link>
                  ) : (
                    n.text
                  )}
                  <When iso={n.at} className="block text-xs text-flash-500" />
                </li>
              ))}
            </ul>
          ) : (
            <p className="text-flash-600">No notices yet.</p>
          )}
        </div>
      ) : null}
    </div>
  );
}
