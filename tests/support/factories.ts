// Shared factories and helpers for integration tests.
import { encode } from "next-auth/jwt";
import { NextRequest } from "next/server";
import type { Role } from "../../lib/auth/roles";
import { hashPassword } from "../../lib/services/accounts";
import { BLANK_ITEM, type ItemInput } from "../../lib/validation/lots";
import { db, User } from "../../models";
import { until } from "./wait";

let n = 0;

export async function makeUser(roles: Role[], password = "correct-horse-battery"): Promise<User> {
  db();
  n += 1;
  return User.create({
    email: `person${Date.now()}${n}@example.test`,
    displayName: `Test person ${n}`,
    passwordHash: await hashPassword(password),
    roles,
  });
}

/** A next-auth session cookie for the user, signed with the test secret. */
export async function sessionCookie(user: User): Promise<string> {
  const token = await encode({
    token: {
      uid: user.id,
      roles: user.roles,
      sv: user.sessionVersion ?? 0,
      email: user.email,
      name: user.displayName,
      sub: user.id,
    },
    secret: process.env.NEXTAUTH_SECRET!,
  });
  return `next-auth.session-token=${token}`;
}

export function request(
  url: string,
  init: { method?: string; json?: unknown; body?: string; headers?: Record<string, string> } = {},
): NextRequest {
  const headers: Record<string, string> = { host: "localhost:3000", ...init.headers };
  let body = init.body;
  if (init.json !== undefined) {
    body = JSON.stringify(init.json);
    headers["content-type"] ??= "application/json";
  }
  return new NextRequest(new URL(url, "http://localhost:3000"), {
    method: init.method ?? (body ? "POST" : "GET"),
    headers,
    body,
  });
}

export const noParams = { params: Promise.resolve({}) };

/** Messages the local mail catcher holds for an address, newest first. */
type CaughtMail = {
  subject: string;
  text: string;
  attachments?: { filename: string; contentType: string; size: number }[];
};

export async function inbox(to: string): Promise<CaughtMail[]> {
  const res = await fetch(`${process.env.MAIL_CATCHER_URL}/api/messages?to=${encodeURIComponent(to)}`);
  return (await res.json()) as CaughtMail[];
}

/** The newest message for an address whose subject matches, waiting for it to arrive. */
export async function waitForSubject(to: string, subject: RegExp, timeoutMs = 8000): Promise<CaughtMail> {
  const mails = await until(
    () => inbox(to),
    (m) => m.some((x) => subject.test(x.subject)),
    timeoutMs,
  ).catch(() => {
    throw new Error(`no mail matching ${subject} for ${to}`);
  });
  return mails.find((m) => subject.test(m.subject))!;
}

export async function waitForMail(to: string, timeoutMs = 5000): Promise<CaughtMail> {
  const mails = await until(
    () => inbox(to),
    (m) => m.length > 0,
    timeoutMs,
  ).catch(() => {
    throw new Error(`no mail for ${to}`);
  });
  return mails[0]!;
}

/** Wait until a sale lot's closing time has passed by the database's clock (the one the closer reads). */
export async function untilClosingTimePassed(saleLotId: string, timeoutMs = 10_000): Promise<void> {
  const { QueryTypes } = await import("sequelize");
  const { db } = await import("../../models");
  await until(
    async () =>
      (
        await db().query<{ due: boolean }>(`SELECT closes_at <= now() AS due FROM sale_lots WHERE id = :id`, {
          replacements: { id: saleLotId },
          type: QueryTypes.SELECT,
        })
      )[0]?.due === true,
    (due) => due,
    timeoutMs,
  );
}

/** The viewer object the guards produce, for calling services directly. */
export function viewerOf(u: User) {
  return { id: u.id, email: u.email, name: u.displayName, roles: [...u.roles] };
}

/** A plain item as the consignor's form sends it. */
export function itemInput(over: Partial<ItemInput> = {}): ItemInput {
  return {
    ...BLANK_ITEM,
    designation: "12AX7",
    quantity: 1,
    labelBrand: "Fairmont Home Radio",
    ...over,
  };
}

/** An approved lot (one plain item unless others are given), ready to be offered in a sale. */
export async function approvedLot(
  consignor: User,
  admin: User,
  reserveCents = 5_000,
  items: import("../../lib/validation/lots").ItemInput[] = [itemInput()],
) {
  const { createLot, addItem } = await import("../../lib/services/lots");
  const { submitLot, decideLot } = await import("../../lib/services/lot-review");
  const lot = await createLot(viewerOf(consignor), {
    title: `Test lot ${Date.now()}`,
    provenance: "",
    shippingOrigin: "",
    testerKind: "untested",
    testerNotes: "",
  });
  for (const item of items) await addItem(viewerOf(consignor), lot.id, item);
  await submitLot(viewerOf(consignor), lot.id);
  await decideLot(viewerOf(admin), lot.id, {
    action: "approve",
    comment: "",
    estimateLowCents: reserveCents,
    estimateHighCents: reserveCents * 2,
    reserveCents,
    reserveAgreed: true,
  });
  return lot;
}

/**
 * A lot sold in a one-lot sale that closes within seconds: `maxes` are the winner's and the under-bidder's
 * maximum bids. Returns the unpaid invoice with its parties.
 */
export async function invoicedLot(
  maxes: [number, number] = [3_000, 2_500],
  items: import("../../lib/validation/lots").ItemInput[] = [itemInput()],
) {
  const { QueryTypes } = await import("sequelize");
  const { db } = await import("../../models");
  const { createSale } = await import("../../lib/services/sales");
  const { placeMaxBid } = await import("../../lib/services/bidding");
  const { closeSaleLot } = await import("../../lib/services/lot-closing");
  const admin = await makeUser(["admin"]);
  const consignor = await makeUser(["consignor"]);
  const lot = await approvedLot(consignor, admin, 2_000, items);
  const sale = await createSale(viewerOf(admin), {
    title: "Test sale",
    startsAt: new Date(Date.now() - 60_000).toISOString(),
    firstCloseAt: new Date(Date.now() + 2_500).toISOString(),
    gapSeconds: 30,
    softCloseSeconds: 1,
    lots: [{ lotId: lot.id, openingCents: 1_000 }],
  });
  const one = async <T extends object>(sql: string, id: string) =>
    (await db().query<T>(sql, { replacements: { id }, type: QueryTypes.SELECT }))[0]!;
  const sl = await one<{ id: string }>(`SELECT id FROM sale_lots WHERE sale_id = :id`, sale.id);
  const buyer = await makeUser(["dealer"]);
  const under = await makeUser(["dealer"]);
  await placeMaxBid(viewerOf(buyer), sl.id, maxes[0], `win-${sl.id}`);
  await placeMaxBid(viewerOf(under), sl.id, maxes[1], `under-${sl.id}`);
  await untilClosingTimePassed(sl.id); // the sale's first close, with its one-second soft close
  if ((await closeSaleLot(sl.id)) !== "closed") throw new Error("the test lot did not close");
  const inv = await one<{ id: string }>(`SELECT id FROM invoices WHERE sale_lot_id = :id`, sl.id);
  return { invoiceId: inv.id, saleId: sale.id, saleLotId: sl.id, lotId: lot.id, admin, consignor, buyer, under };
}
