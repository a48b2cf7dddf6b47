import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { beginLotWrite, finishLotWrite } from "@/lib/realtime/lot-emitter";
import type { LotLive } from "@/lib/realtime/events";

// [SUG] Our delivery rule: a lot's events leave a process in seq order even when its writers finish out of order.
const sent: { event: string; seqs: number[] }[] = [];
const fakeIo = {
  local: {
    to: () => ({
      emit: (event: string, p: LotLive | { events: { live: LotLive }[] }) =>
        sent.push({ event, seqs: "events" in p ? p.events.map((e) => e.live.seq) : [p.seq] }),
    }),
  },
  serverSideEmit: () => undefined,
};
const live = (saleLotId: string, seq: number) => ({ saleLotId, saleId: "s", seq }) as LotLive;

describe("lot emitter", () => {
  const g = globalThis as { __getterlineIo?: unknown };
  beforeAll(() => {
    g.__getterlineIo = fakeIo;
  });
  afterAll(() => {
    delete g.__getterlineIo;
  });

  it("holds a later seq until the earlier writer in this process finishes, then sends both in order", async () => {
    sent.length = 0;
    finishLotWrite((beginLotWrite("a"), "a"), { kind: "lot.bid", live: live("a", 1) }); // establishes the lot's last seq
    await vi.waitFor(() => expect(sent).toHaveLength(1));
    beginLotWrite("a"); // writer of seq 2
    beginLotWrite("a"); // writer of seq 3, whose reply comes back first
    finishLotWrite("a", { kind: "lot.bid", live: live("a", 3) });
    await new Promise((r) => setImmediate(r));
    expect(sent).toHaveLength(1);
    finishLotWrite("a", { kind: "lot.bid", live: live("a", 2) });
    await vi.waitFor(() => expect(sent).toHaveLength(2));
    expect(sent[1]).toEqual({ event: "lot.batch", seqs: [2, 3] });
  });

  it("does not wait for a seq no writer here is producing (another instance committed it)", async () => {
    sent.length = 0;
    finishLotWrite((beginLotWrite("b"), "b"), { kind: "lot.bid", live: live("b", 1) });
    await vi.waitFor(() => expect(sent).toHaveLength(1));
    beginLotWrite("b");
    finishLotWrite("b", { kind: "lot.bid", live: live("b", 3) });
    await vi.waitFor(() => expect(sent.map((x) => x.seqs)).toEqual([[1], [3]]));
  });
});
