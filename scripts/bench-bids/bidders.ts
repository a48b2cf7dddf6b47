// Bid benchmark: dealers placing bids over the socket (default) or HTTP (closed loop for saturation, open loop for latency).
import http from "node:http";
import { io as connect, type Socket } from "socket.io-client";
import { randomUUID } from "node:crypto";
import { performance } from "node:perf_hooks";

/** Epoch milliseconds with sub-millisecond resolution (comparable across the bench's processes). */
export const now = () => performance.timeOrigin + performance.now();

export type BidAnswer =
  | { kind: "accepted"; seq: number; minimumCents: number; replayed: boolean }
  | { kind: "refused"; reason: string; minimumCents: number }
  | { kind: "error"; status: number; message: string };

/** One accepted bid as the API answered it. */
export type Accepted = { seq: number; key: string; bidder: number; sentAt: number; answeredAt: number; phase: string };

/** Everything a phase saw, for the checks and the figures. */
export class Ledger {
  accepted: Accepted[] = [];
  refused = new Map<string, number>();
  errors = new Map<string, number>();
  /** Every key sent, with its bidder and whether an answer came back (unanswered ones may still be in the table). */
  sent = new Map<string, { bidder: number; answered: boolean }>();
  /** The highest minimum seen in any answer; minimums only rise on this lot. */
  minimumCents = 0;

  count(map: Map<string, number>, k: string): void {
    map.set(k, (map.get(k) ?? 0) + 1);
  }
}

/** What the loops need from a way of sending bids. */
export interface BidSender {
  bid(dealer: number, maxCents: number, key: string, timeoutMs?: number): Promise<BidAnswer>;
  close(): void;
}

/** Each dealer's own authenticated socket, bidding with "bid.place" and its ack (as the lot page does). */
export class SocketBidClient implements BidSender {
  private sockets: Socket[] = [];
  private constructor(private saleLotId: string) {}

  static async open(port: number, saleLotId: string, cookies: string[]): Promise<SocketBidClient> {
    const c = new SocketBidClient(saleLotId);
    c.sockets = await Promise.all(
      cookies.map(
        (cookie) =>
          new Promise<Socket>((resolve, reject) => {
            const s = connect(`http://127.0.0.1:${port}`, {
              path: "/socket.io",
              transports: ["websocket"],
              forceNew: true,
              extraHeaders: { cookie },
            });
            s.once("session.ready", () => resolve(s));
            s.once("connect_error", reject);
          }),
      ),
    );
    return c;
  }

  async bid(dealer: number, maxCents: number, key: string, timeoutMs = 30_000): Promise<BidAnswer> {
    try {
      const ack = (await this.sockets[dealer]!.timeout(timeoutMs).emitWithAck("bid.place", {
        saleLotId: this.saleLotId,
        maxCents,
        idempotencyKey: key,
      })) as SocketAnswer;
      if (ack.ok)
        return {
          kind: "accepted",
          seq: Number(ack.result?.seq),
          minimumCents: Number(ack.result?.live?.minimumCents ?? 0),
          replayed: Boolean(ack.result?.replayed),
        };
      if (ack.error?.code === "conflict" && ack.error.details?.reason) {
        return {
          kind: "refused",
          reason: String(ack.error.details.reason),
          minimumCents: Number(ack.error.details.minimumCents ?? 0),
        };
      }
      return { kind: "error", status: 0, message: String(ack.error?.code ?? "unexpected answer") };
    } catch (e) {
      return { kind: "error", status: 0, message: (e as Error).message };
    }
  }

  close(): void {
    for (const s of this.sockets) s.disconnect();
  }
}

/** What the server's answers carry, as far as the bench reads them. */
type Refusal = {
  code?: string;
  details?: { reason?: string; minimumCents?: number; live?: { minimumCents?: number } };
};
type SocketAnswer = {
  ok?: boolean;
  result?: { seq?: number; replayed?: boolean; live?: { minimumCents?: number } };
  error?: Refusal;
};
type HttpAnswer = {
  accepted?: boolean;
  seq?: number;
  replayed?: boolean;
  live?: { minimumCents?: number };
  error?: Refusal;
};

/** A keep-alive HTTP client for the bid route, one cookie per dealer. */
export class BidClient implements BidSender {
  private agent: http.Agent;
  constructor(
    private port: number,
    private saleLotId: string,
    private cookies: string[],
    maxSockets: number,
  ) {
    this.agent = new http.Agent({ keepAlive: true, maxSockets, maxFreeSockets: maxSockets });
  }

  /** POST a maximum bid; no Origin header (same as a non-browser client). */
  bid(dealer: number, maxCents: number, key: string, timeoutMs = 30_000): Promise<BidAnswer> {
    const body = JSON.stringify({ maxCents, idempotencyKey: key });
    return new Promise((resolve) => {
      const req = http.request(
        {
          host: "127.0.0.1",
          port: this.port,
          method: "POST",
          path: `/api/sale-lots/${this.saleLotId}/bids`,
          agent: this.agent,
          headers: {
            cookie: this.cookies[dealer]!,
            "content-type": "application/json",
            "content-length": Buffer.byteLength(body),
            accept: "application/json",
          },
          timeout: timeoutMs,
        },
        (res) => {
          const chunks: Buffer[] = [];
          res.on("data", (c: Buffer) => chunks.push(c));
          res.on("end", () => {
            const status = res.statusCode ?? 0;
            let j: HttpAnswer;
            try {
              j = JSON.parse(Buffer.concat(chunks).toString("utf8")) as HttpAnswer;
            } catch {
              return resolve({ kind: "error", status, message: "not json" });
            }
            if (status === 200 && j.accepted === true)
              return resolve({
                kind: "accepted",
                seq: Number(j.seq),
                minimumCents: Number(j.live?.minimumCents ?? 0),
                replayed: Boolean(j.replayed),
              });
            if (status === 409 && j.error?.details?.reason) {
              return resolve({
                kind: "refused",
                reason: String(j.error.details.reason),
                minimumCents: Number(j.error.details.minimumCents ?? j.error.details.live?.minimumCents ?? 0),
              });
            }
            resolve({ kind: "error", status, message: String(j.error?.code ?? "unexpected answer") });
          });
          res.on("error", (e) => resolve({ kind: "error", status: 0, message: e.message }));
        },
      );
      req.on("timeout", () => req.destroy(new Error("timeout")));
      req.on("error", (e) => resolve({ kind: "error", status: 0, message: e.message }));
      req.end(body);
    });
  }

  close(): void {
    this.agent.destroy();
  }
}

function record(ledger: Ledger, phase: string, dealer: number, key: string, sentAt: number, a: BidAnswer): void {
  const answeredAt = now();
  const s = ledger.sent.get(key);
  if (s && a.kind !== "error") s.answered = true;
  if (a.kind === "accepted") {
    ledger.accepted.push({ seq: a.seq, key, bidder: dealer, sentAt, answeredAt, phase });
    if (a.minimumCents > ledger.minimumCents) ledger.minimumCents = a.minimumCents;
  } else if (a.kind === "refused") {
    ledger.count(ledger.refused, a.reason);
    if (a.minimumCents > ledger.minimumCents) ledger.minimumCents = a.minimumCents;
  } else {
    ledger.count(ledger.errors, `${a.status} ${a.message}`);
  }
}

/**
 * Closed loop: each of M dealers enters a maximum a little above the current
 * minimum (the highest minimum any answer has shown, plus 0–20 increments, as
 * dealers do when they bid in earnest), with a fresh key, as fast as answers
 * come back, until the deadline. Returns when every request has been answered.
 */
export async function saturate(
  client: BidSender,
  ledger: Ledger,
  dealers: number,
  seconds: number,
  phase = "saturation",
  abort: () => boolean = () => false,
): Promise<{ elapsedMs: number; sent: number }> {
  const start = now();
  const deadline = start + seconds * 1000;
  let sent = 0;
  let lastAnswer = start;
  const loop = async (dealer: number) => {
    while (now() < deadline && !abort()) {
      const key = `bench-${randomUUID()}`;
      const amount = ledger.minimumCents + 100 * Math.floor(Math.random() * 21);
      ledger.sent.set(key, { bidder: dealer, answered: false });
      sent++;
      const sentAt = now();
      const a = await client.bid(dealer, amount, key);
      record(ledger, phase, dealer, key, sentAt, a);
      lastAnswer = now();
      // An error (not a refusal) gets a short pause so a broken server is not hammered blindly.
      if (a.kind === "error") await new Promise((r) => setTimeout(r, 50));
    }
  };
  await Promise.all(Array.from({ length: dealers }, (_, d) => loop(d)));
  return { elapsedMs: lastAnswer - start, sent };
}

/**
 * Open loop: bids are sent on a fixed schedule (rate per second) whatever
 * the answers do, rotating over the dealers. Each bid's maximum is two
 * increments above the previous one sent (or the highest minimum seen, if
 * that is higher): bids arriving in order are each accepted as the new
 * leader, and a bid overtaken in the server by the next one is still above
 * the minimum and accepted (outbid by proxy) instead of refused. Records how
 * late each send was against its schedule.
 */
export async function openLoop(
  client: BidSender,
  ledger: Ledger,
  dealers: number,
  seconds: number,
  rate: number,
  incrementCents: number,
  abort: () => boolean = () => false,
): Promise<{ sent: number; sendLagMs: number[] }> {
  const interval = 1000 / rate;
  const total = Math.max(1, Math.round(seconds * rate));
  const start = now() + 20;
  const inflight: Promise<void>[] = [];
  const sendLagMs: number[] = [];
  let nextAmount = ledger.minimumCents;
  let i = 0;
  await new Promise<void>((resolve) => {
    const tick = () => {
      const t = now();
      while (i < total && start + i * interval <= t) {
        const scheduled = start + i * interval;
        const dealer = i % dealers;
        nextAmount = Math.max(nextAmount, ledger.minimumCents);
        const amount = nextAmount;
        nextAmount += 2 * incrementCents;
        const key = `bench-${randomUUID()}`;
        ledger.sent.set(key, { bidder: dealer, answered: false });
        const sentAt = now();
        sendLagMs.push(sentAt - scheduled);
        inflight.push(client.bid(dealer, amount, key).then((a) => record(ledger, "latency", dealer, key, sentAt, a)));
        i++;
      }
      if (i >= total || abort()) return resolve();
      setTimeout(tick, Math.max(0, start + i * interval - now()));
    };
    setTimeout(tick, Math.max(0, start - now()));
  });
  await Promise.all(inflight);
  return { sent: i, sendLagMs };
}
