import { Op, QueryTypes } from "sequelize";
import type { Viewer } from "../auth/guards";
import { ApiError } from "../api/errors";
import { initialProxyState } from "../auction/proxy";
import { staggeredCloseTimes } from "../auction/soft-close";
import { type LotLive } from "../realtime/events";
import type { SaleCreateInput } from "../validation/sales";
import { db, Lot, Sale, SaleLot } from "../../models";
import { lotChanged } from "./catalogue/events";
import { scheduleClose } from "./close-schedule";
import { currentSettings } from "./house-settings";
import { liveFrom, type LiveSource } from "./live-lot";
import { paddlesOf } from "./paddles";
import { BID_LOG_COLUMNS, bidColumns, type BidLogRow } from "./bid-rows";
import type { SaleLotRow } from "./sale-lot-rows";

/**
 * The house schedules approved lots into a sale with staggered closing
 * times, and queues each lot's close. Lots already offered are refused. It freezes the house settings version in force.
 */
export async function createSale(admin: Viewer | null, input: SaleCreateInput, opts: { isDemo?: boolean } = {}) {
  const s = db();
  const closes = staggeredCloseTimes(Date.parse(input.firstCloseAt), input.gapSeconds, input.lots.length);
  const sale = await s.transaction(async (t) => {
    const { version, settings } = await currentSettings(t);
    const lots = await Lot.findAll({
      where: { id: { [Op.in]: input.lots.map((l) => l.lotId) } },
      lock: t.LOCK.UPDATE,
      transaction: t,
    });
    const byId = new Map(lots.map((l) => [l.id, l]));
    // A lot that closed unsold or was withdrawn may be offered again; one open or sold is not.
    const offered = await SaleLot.findAll({
      where: { lotId: { [Op.in]: input.lots.map((l) => l.lotId) }, phase: { [Op.in]: ["open", "sold"] } },
      attributes: ["lotId"],
      transaction: t,
    });
    if (offered.length)
      throw new ApiError("conflict", "Some of these lots are already in a sale", {
        lots: `${offered.length} already offered`,
      });
    const fields: Record<string, string> = {};
    input.lots.forEach((l, i) => {
      const lot = byId.get(l.lotId);
      if (!lot || lot.state !== "approved") fields[`lots.${i}`] = "Only approved lots can be offered";
      else if (lot.reserveCents != null && l.openingCents > lot.reserveCents)
        fields[`lots.${i}`] = "The opening price is above the agreed reserve";
    });
    if (Object.keys(fields).length) throw new ApiError("validation_failed", "Some lots cannot be offered", fields);
    const sale = await Sale.create(
      {
        title: input.title,
        startsAt: new Date(input.startsAt),
        softCloseSeconds: input.softCloseSeconds ?? settings.softClose.windowSeconds,
        settingsVersion: version,
        maxExtensions: settings.softClose.maxExtensions,
        isDemo: opts.isDemo ?? false,
        createdBy: admin?.id ?? null,
      },
      { transaction: t },
    );
    await SaleLot.bulkCreate(
      input.lots.map((l, i) => {
        const lot = byId.get(l.lotId)!;
        const reserve = lot.reserveCents != null && lot.reserveCents > l.openingCents ? lot.reserveCents : null;
        return {
          saleId: sale.id,
          lotId: lot.id,
          position: i + 1,
          consignorId: lot.consignorId,
          openingCents: l.openingCents,
          closesAt: new Date(closes[i]!),
          originalCloseAt: new Date(closes[i]!),
          state: initialProxyState({
            openingCents: l.openingCents,
            reserveCents: reserve,
            ladder: settings.incrementLadder,
            consignorId: lot.consignorId,
          }),
        };
      }),
      { transaction: t },
    );
    return sale;
  });
  const saleLots = await SaleLot.findAll({ where: { saleId: sale.id }, attributes: ["id", "closesAt"] });
  for (const sl of saleLots) await scheduleClose(sl.id, sl.closesAt);
  for (const l of input.lots) await lotChanged(l.lotId, "scheduled");
  return { id: sale.id, lots: saleLots.length };
}

/** A sale lot's live columns with its lot's title, its consignor's name and the leader's paddle (joined). */
type LiveRow = LiveSource &
  Pick<SaleLotRow, "lot_id" | "position"> & { title: string; consignor: string; leader_paddle: number | null };

/** Sale lots with their live state and the leader's paddle (any number of sales, one query). */
export async function liveRows(
  where: string,
  replacements: Record<string, unknown>,
  order = "sl.position",
): Promise<(LotLive & { lotId: string; title: string; position: number; consignor: string })[]> {
  const rows = await db().query<LiveRow>(
    `SELECT sl.id, sl.sale_id, sl.lot_id, l.title, sl.position, sl.phase, sl.seq, sl.state, sl.closes_at, sl.hammer_cents, u.display_name AS consignor, p.number AS leader_paddle
       FROM sale_lots sl JOIN lots l ON l.id = sl.lot_id JOIN users u ON u.id = l.consignor_id
       LEFT JOIN paddles p ON p.sale_id = sl.sale_id AND p.user_id = sl.leader_id
      WHERE ${where} ORDER BY ${order}`,
    { replacements, type: QueryTypes.SELECT },
  );
  return rows.map((r) => ({
    ...liveFrom(r, r.leader_paddle ?? null),
    lotId: r.lot_id,
    title: r.title,
    position: r.position,
    consignor: r.consignor,
  }));
}

/** Sales with counts, newest first. */
export async function listSales() {
  return db()
    .query<{
      id: string;
      title: string;
      starts_at: Date;
      lots: string;
      open: string;
      first_close: Date;
      last_close: Date;
      is_demo: boolean;
    }>(
      `SELECT s.id, s.title, s.starts_at, s.is_demo, COUNT(sl.id) AS lots, COUNT(sl.id) FILTER (WHERE sl.phase = 'open') AS open,
            MIN(sl.closes_at) AS first_close, MAX(sl.closes_at) AS last_close
       FROM sales s LEFT JOIN sale_lots sl ON sl.sale_id = s.id GROUP BY s.id ORDER BY s.starts_at DESC LIMIT 100`,
      { type: QueryTypes.SELECT },
    )
    .then((rows) =>
      rows.map((r) => ({
        id: r.id,
        title: r.title,
        startsAt: r.starts_at.toISOString(),
        isDemo: r.is_demo,
        lots: Number(r.lots),
        open: Number(r.open),
        firstClose: r.first_close?.toISOString() ?? null,
        lastClose: r.last_close?.toISOString() ?? null,
      })),
    );
}

/** One sale with every lot's live state and, for a viewer, their paddle, ceilings and watched lots. */
export async function getSale(saleId: string, viewer?: Viewer) {
  db();
  const sale = await Sale.findByPk(saleId);
  if (!sale) throw new ApiError("not_found", "No such sale");
  return {
    sale: {
      id: sale.id,
      title: sale.title,
      startsAt: sale.startsAt.toISOString(),
      softCloseSeconds: sale.softCloseSeconds,
      isDemo: sale.isDemo,
    },
    lots: await liveRows("sl.sale_id = :saleId", { saleId }),
    you: viewer ? await yourPlaceIn(saleId, viewer.id) : { paddle: null, ceilings: {}, watched: [] },
  };
}

/** A dealer's paddle in a sale, their highest standing ceiling per lot and the lots they follow (one query). */
async function yourPlaceIn(
  saleId: string,
  userId: string,
): Promise<{ paddle: number | null; ceilings: Record<string, number>; watched: string[] }> {
  const [r] = await db().query<{
    paddle: number | null;
    ceilings: Record<string, number> | null;
    watched: string[] | null;
  }>(
    `SELECT (SELECT number FROM paddles WHERE sale_id = :saleId AND user_id = :userId) AS paddle,
            (SELECT jsonb_object_agg(sale_lot_id, m) FROM (SELECT b.sale_lot_id, MAX(b.max_cents) AS m FROM bids b JOIN sale_lots sl ON sl.id = b.sale_lot_id
               WHERE sl.sale_id = :saleId AND b.bidder_id = :userId AND b.retracted_at IS NULL GROUP BY b.sale_lot_id) x) AS ceilings,
            (SELECT array_agg(w.sale_lot_id) FROM watches w JOIN sale_lots sl ON sl.id = w.sale_lot_id WHERE sl.sale_id = :saleId AND w.user_id = :userId) AS watched`,
    { replacements: { saleId, userId }, type: QueryTypes.SELECT },
  );
  return { paddle: r?.paddle ?? null, ceilings: r?.ceilings ?? {}, watched: r?.watched ?? [] };
}

/**
 * A sale lot as the viewer sees it: live state, bid history by paddle
 * number (never names), and the viewer's own standing and maximum.
 */
export async function getSaleLot(viewer: Viewer, saleLotId: string) {
  const [live] = await liveRows("sl.id = :saleLotId", { saleLotId });
  if (!live) throw new ApiError("not_found", "No such lot in a sale");
  const s = db();
  const [sale] = await s.query<{ title: string; starts_at: Date; soft_close_seconds: number }>(
    `SELECT title, starts_at, soft_close_seconds FROM sales WHERE id = :id`,
    { replacements: { id: live.saleId }, type: QueryTypes.SELECT },
  );
  const bids = await s.query<BidLogRow & { number: number | null }>(
    `SELECT ${bidColumns(BID_LOG_COLUMNS, "b")}, p.number
       FROM bids b LEFT JOIN paddles p ON p.sale_id = :saleId AND p.user_id = b.bidder_id WHERE b.sale_lot_id = :saleLotId ORDER BY b.seq DESC LIMIT 200`,
    { replacements: { saleId: live.saleId, saleLotId }, type: QueryTypes.SELECT },
  );
  const [row] = await s.query<Pick<SaleLotRow, "state" | "consignor_id">>(
    `SELECT state, consignor_id FROM sale_lots WHERE id = :saleLotId`,
    { replacements: { saleLotId }, type: QueryTypes.SELECT },
  );
  const mine = bids.filter((b) => b.bidder_id === viewer.id && !b.retracted_at);
  const [watch] = await s.query<{ n: number }>(`SELECT 1 AS n FROM watches WHERE user_id = :u AND sale_lot_id = :l`, {
    replacements: { u: viewer.id, l: saleLotId },
    type: QueryTypes.SELECT,
  });
  const isHouse = viewer.roles.includes("admin");
  // A leader raising their own ceiling is private: no public row unless the price moved.
  const priceBefore = new Map<number, number>();
  [...bids].reverse().reduce((prev, b) => {
    priceBefore.set(b.seq, prev);
    return b.retracted_at ? prev : b.price_after_cents;
  }, -1);
  const privateRaise = (b: (typeof bids)[number]) =>
    b.outcome === "max-raised" && priceBefore.get(b.seq) === b.price_after_cents;
  return {
    live,
    sale: { title: sale!.title, startsAt: sale!.starts_at.toISOString(), softCloseSeconds: sale!.soft_close_seconds },
    lot: await lotFacts(live.lotId),
    history: bids
      .filter((b) => isHouse || b.bidder_id === viewer.id || !privateRaise(b))
      .map((b) => ({
        id: isHouse ? String(b.id) : undefined,
        seq: b.seq,
        paddle: b.number,
        priceAfterCents: b.price_after_cents,
        at: b.placed_at.toISOString(),
        retracted: Boolean(b.retracted_at),
        retractReason: b.retract_reason,
        mine: b.bidder_id === viewer.id,
        privateRaise: privateRaise(b),
      })),
    you: {
      paddle: mine.length ? ((await paddlesOf(live.saleId, [viewer.id])).get(viewer.id) ?? null) : null,
      maxCents: mine.length ? Math.max(...mine.map((b) => b.max_cents)) : null,
      leading: row!.state.leader?.bidderId === viewer.id,
      bidding: mine.length > 0,
      ownLot: row!.consignor_id === viewer.id,
      watching: Boolean(watch),
    },
  };
}

/** What a dealer reads beside the bid form: estimate, tube count, conditions and a first photo. */
async function lotFacts(lotId: string) {
  const [r] = await db().query<{
    estimate_low_cents: number | null;
    estimate_high_cents: number | null;
    tubes: string | null;
    conditions: Record<string, number> | null;
    photo_id: string | null;
  }>(
    `SELECT l.estimate_low_cents, l.estimate_high_cents,
            (SELECT SUM(quantity) FROM lot_items WHERE lot_id = l.id) AS tubes,
            (SELECT jsonb_object_agg(condition, n) FROM (SELECT condition, SUM(quantity)::int AS n FROM lot_items WHERE lot_id = l.id GROUP BY condition) c) AS conditions,
            (SELECT id FROM lot_photos WHERE lot_id = l.id ORDER BY created_at LIMIT 1) AS photo_id
       FROM lots l WHERE l.id = :lotId`,
    { replacements: { lotId }, type: QueryTypes.SELECT },
  );
  return {
    estimateLowCents: r?.estimate_low_cents ?? null,
    estimateHighCents: r?.estimate_high_cents ?? null,
    tubes: Number(r?.tubes ?? 0),
    conditions: r?.conditions ?? {},
    photoId: r?.photo_id ?? null,
  };
}

/** Watch or stop watching a sale lot. */
export async function setWatch(viewer: Viewer, saleLotId: string, on: boolean): Promise<{ watching: boolean }> {
  const s = db();
  if (on) {
    await s.query(
      `INSERT INTO watches (user_id, sale_lot_id, created_at) SELECT :u, id, now() FROM sale_lots WHERE id = :l ON CONFLICT DO NOTHING`,
      { replacements: { u: viewer.id, l: saleLotId } },
    );
  } else {
    await s.query(`DELETE FROM watches WHERE user_id = :u AND sale_lot_id = :l`, {
      replacements: { u: viewer.id, l: saleLotId },
    });
  }
  return { watching: on };
}

/** The viewer's watchlist with live states, read in one query. */
export async function watchlist(viewer: Viewer) {
  return liveRows("sl.id IN (SELECT sale_lot_id FROM watches WHERE user_id = :u)", { u: viewer.id }, "sl.closes_at");
}

/** Approved lots not yet offered in any sale, for the house's sale form. */
export async function offerableLots() {
  const rows = await db().query<{
    id: string;
    title: string;
    consignor: string;
    estimate_low_cents: number | null;
    estimate_high_cents: number | null;
    reserve_cents: number | null;
  }>(
    `SELECT l.id, l.title, u.display_name AS consignor, l.estimate_low_cents, l.estimate_high_cents, l.reserve_cents
       FROM lots l JOIN users u ON u.id = l.consignor_id
      WHERE l.state = 'approved' AND NOT EXISTS (SELECT 1 FROM sale_lots sl WHERE sl.lot_id = l.id AND sl.phase IN ('open', 'sold')) ORDER BY l.approved_at`,
    { type: QueryTypes.SELECT },
  );
  return rows.map((r) => ({
    id: r.id,
    title: r.title,
    consignor: r.consignor,
    estimateLowCents: r.estimate_low_cents,
    estimateHighCents: r.estimate_high_cents,
    reserveCents: r.reserve_cents,
  }));
}
