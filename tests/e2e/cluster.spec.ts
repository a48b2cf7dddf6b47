import { spawn, type ChildProcess } from "node:child_process";
import { expect, test } from "@playwright/test";
import { encode } from "next-auth/jwt";
import pg from "pg";
import { io } from "socket.io-client";
import { BLANK_ITEM } from "../../lib/validation/lots";

// Two app instances on one PostgreSQL: broadcasts cross instances through the
// Postgres adapter; killing one mid-sale loses no committed bid and every lot
// still closes exactly once (pg-boss jobs plus the sweeper, from the survivor).
const DB = process.env.E2E_DATABASE_URL ?? "postgres://app@127.0.0.1:54329/getterline_e2e";
const PORTS = [3201, 3202];
const base = (p: number) => `http://localhost:${p}`;

function startInstance(port: number): ChildProcess {
  return spawn(process.execPath, ["--import", "tsx", "server/index.ts"], {
    env: {
      ...process.env,
      NODE_ENV: "production",
      PORT: String(port),
      NEXTAUTH_URL: base(port),
      DATABASE_URL: DB,
      SMTP_PORT: "2525",
      MAIL_CATCHER_URL: "http://127.0.0.1:2580",
      S3_ENDPOINT: "http://127.0.0.1:4589",
      STRIPE_API_PORT: "12121",
      DEMO_LIVE: "0",
    },
    stdio: "ignore",
  });
}

async function healthy(port: number): Promise<void> {
  await expect
    .poll(
      async () => {
        try {
          return (await fetch(`${base(port)}/api/health`)).ok;
        } catch {
          return false; // not up yet
        }
      },
      { timeout: 60_000, intervals: [250], message: `instance on ${port} did not come up` },
    )
    .toBe(true);
}

async function cookieFor(client: pg.Client, email: string): Promise<string> {
  const { rows } = await client.query("SELECT id, roles, display_name FROM users WHERE email = $1", [email]);
  const u = rows[0];
  const token = await encode({
    token: { uid: u.id, roles: u.roles, email, name: u.display_name, sub: u.id },
    secret: process.env.NEXTAUTH_SECRET!,
  });
  return `next-auth.session-token=${token}`;
}

async function call(port: number, cookie: string, method: string, path: string, body?: unknown) {
  const res = await fetch(`${base(port)}${path}`, {
    method,
    headers: { cookie, "content-type": "application/json" },
    body: body === undefined ? undefined : JSON.stringify(body),
  });
  return { status: res.status, body: (await res.json()) as Record<string, unknown> };
}

test("two instances: broadcasts cross, a killed instance loses no committed bid, every lot closes exactly once", async () => {
  test.setTimeout(180_000);
  const db = new pg.Client({ connectionString: DB });
  await db.connect();
  const [a, b] = PORTS.map(startInstance) as [ChildProcess, ChildProcess];
  try {
    await Promise.all(PORTS.map(healthy));
    const admin = await cookieFor(db, "priya@house.getterline.test");
    const consignor = await cookieFor(db, "odette@consignor.getterline.test");
    const dealers = await Promise.all(
      ["quill@dealer.getterline.test", "bellweather@dealer.getterline.test", "northbank@dealer.getterline.test"].map(
        (e) => cookieFor(db, e),
      ),
    );

    // Three approved lots, made through the API (titles unique to this run).
    const run = Date.now().toString(36);
    const lotIds: string[] = [];
    for (let i = 0; i < 3; i++) {
      const lot = (
        await call(PORTS[0]!, consignor, "POST", "/api/lots", {
          title: `Cluster lot ${i + 1} ${run}`,
          provenance: "",
          shippingOrigin: "",
          testerKind: "untested",
          testerNotes: "",
        })
      ).body.lot as { id: string };
      const item = {
        ...BLANK_ITEM,
        designation: "6V6GT",
        quantity: 2,
        labelBrand: "Tri-County Parts",
      };
      expect((await call(PORTS[0]!, consignor, "POST", `/api/lots/${lot.id}/items`, item)).status).toBe(201);
      expect((await call(PORTS[1]!, consignor, "POST", `/api/lots/${lot.id}/submit`)).status).toBe(200);
      expect(
        (
          await call(PORTS[1]!, admin, "POST", `/api/house/lots/${lot.id}/decision`, {
            action: "approve",
            comment: "",
            estimateLowCents: 5_000,
            estimateHighCents: 9_000,
            reserveCents: 2_000,
            reserveAgreed: true,
          })
        ).status,
      ).toBe(200);
      lotIds.push(lot.id);
    }
    const created = await call(PORTS[0]!, admin, "POST", "/api/sales", {
      title: "Cluster sale",
      startsAt: new Date(Date.now() - 60_000).toISOString(),
      firstCloseAt: new Date(Date.now() + 45_000).toISOString(),
      gapSeconds: 10,
      softCloseSeconds: 30,
      lots: lotIds.map((lotId) => ({ lotId, openingCents: 1_000 })),
    });
    expect(created.status).toBe(201);
    const saleId = (created.body.sale as { id: string }).id;
    const saleLots = (
      (await call(PORTS[1]!, dealers[0]!, "GET", `/api/sales/${saleId}`)).body.lots as { saleLotId: string }[]
    ).map((l) => l.saleLotId);

    // A watcher on instance B sees a bid placed through instance A.
    const watcher = io(base(PORTS[1]!), {
      path: "/socket.io",
      transports: ["websocket"],
      extraHeaders: { cookie: dealers[2]! },
    });
    await new Promise<void>((r) => watcher.on("session.ready", () => r()));
    await new Promise<void>((r) => watcher.emit("room.join", { room: `lot:${saleLots[0]}` }, () => r()));
    let seenSeq: number | null = null;
    watcher.on("lot.bid", (e: { seq: number }) => (seenSeq ??= e.seq));
    const first = await call(PORTS[0]!, dealers[0]!, "POST", `/api/sale-lots/${saleLots[0]}/bids`, {
      maxCents: 3_000,
      idempotencyKey: "cluster-first",
    });
    expect(first.status).toBe(200);
    await expect.poll(() => seenSeq, { timeout: 3_000, message: "no cross-instance broadcast" }).toBe(1);
    watcher.close();

    // Bids through both instances; instance A is killed part-way.
    let accepted = 1;
    for (let round = 0; round < 12; round++) {
      if (round === 6) a.kill("SIGKILL");
      for (const [i, sl] of saleLots.entries()) {
        const port = round < 6 && i % 2 === 0 ? PORTS[0]! : PORTS[1]!;
        const r = await call(port, dealers[round % 3]!, "POST", `/api/sale-lots/${sl}/bids`, {
          maxCents: 2_000 + round * 700 + i * 100,
          idempotencyKey: `cluster-${round}-${i}`,
        }).catch(() => ({ status: 0, body: {} }));
        if (r.status === 200) accepted++;
      }
    }
    const { rows: stored } = await db.query(
      "SELECT COUNT(*)::int AS n FROM bids b JOIN sale_lots sl ON sl.id = b.sale_lot_id WHERE sl.sale_id = $1",
      [saleId],
    );
    expect(stored[0].n).toBe(accepted); // every bid acknowledged by either instance is committed

    // Every lot closes exactly once, after the kill, from the surviving instance.
    const stillOpen = async () =>
      (await db.query("SELECT COUNT(*)::int AS n FROM sale_lots WHERE sale_id = $1 AND phase = 'open'", [saleId]))
        .rows[0].n;
    await expect.poll(stillOpen, { timeout: 100_000, intervals: [1_000] }).toBe(0);
    const { rows: closed } = await db.query(
      "SELECT phase, closed_at, seq, (SELECT MAX(seq) FROM bids WHERE sale_lot_id = sale_lots.id) AS last_bid FROM sale_lots WHERE sale_id = $1",
      [saleId],
    );
    for (const c of closed) {
      expect(c.phase).toBe("sold");
      expect(c.seq).toBe(c.last_bid + 1); // the close itself took exactly one sequence number
    }
    // The consignor's e-mail follows the close's commit: wait for all three, then check none came twice.
    const sold = async () =>
      ((await (await fetch("http://127.0.0.1:2580/api/messages")).json()) as { subject: string }[]).filter(
        (m) => m.subject.startsWith("Sold: Cluster lot") && m.subject.endsWith(run),
      );
    await expect.poll(async () => (await sold()).length, { timeout: 20_000 }).toBeGreaterThanOrEqual(3);
    // The signal that no closer is still running (a close sends its mail before its job completes): the job
    // queue holds no close job waiting, retrying or active. Only then is a missing duplicate meaningful.
    const closersBusy = async () =>
      (
        await db.query(
          "SELECT COUNT(*)::int AS n FROM pgboss.job WHERE name = 'lot-close' AND state IN ('created', 'retry', 'active') AND start_after <= now()",
        )
      ).rows[0].n;
    await expect.poll(closersBusy, { timeout: 20_000 }).toBe(0);
    const mails = await sold();
    for (let i = 1; i <= 3; i++)
      expect(mails.filter((m) => m.subject === `Sold: Cluster lot ${i} ${run}`)).toHaveLength(1);
  } finally {
    a.kill("SIGKILL");
    b.kill("SIGTERM");
    await db.end();
  }
});
