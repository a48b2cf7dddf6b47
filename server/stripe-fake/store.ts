// The fake's whole state, kept in one JSON file under its data directory. Every change is written
// atomically (temporary file, fsync, rename), so a restart — or a crash — loses nothing that was answered.
// A lock file stops two fakes from sharing one directory.
import {
  closeSync,
  fsyncSync,
  mkdirSync,
  openSync,
  readFileSync,
  renameSync,
  rmSync,
  writeFileSync,
  writeSync,
} from "node:fs";
import path from "node:path";
import type Stripe from "stripe";
import type { CardBehaviour } from "./cards";

/** An event as the fake stores it (Stripe's Event without the per-type union). */
export type FakeEvent = {
  id: string;
  object: "event";
  api_version: string;
  created: number;
  data: { object: Record<string, unknown> };
  livemode: false;
  pending_webhooks: number;
  request: { id: string | null; idempotency_key: string | null };
  type: string;
};

/** Webhook delivery state of one event. Times are milliseconds since the epoch. */
export type Delivery = {
  event: string;
  state: "pending" | "delivered" | "failed";
  attempts: number;
  next_attempt_at: number;
  last_attempt_at: number | null;
  last_status: number | null;
  last_error: string | null;
  delivered_at: number | null;
};

/** A stored answer for an Idempotency-Key. */
export type IdempotencyRecord = {
  method: string;
  path: string;
  fingerprint: string;
  status: number;
  body: string;
  created: number;
};

/** Everything the fake knows. Collections keep insertion order (ids are never integer-like). */
export type State = {
  version: 1;
  payment_methods: Record<string, Stripe.PaymentMethod>;
  payment_intents: Record<string, Stripe.PaymentIntent>;
  charges: Record<string, Stripe.Charge>;
  refunds: Record<string, Stripe.Refund>;
  balance_transactions: Record<string, Stripe.BalanceTransaction>;
  accounts: Record<string, Stripe.Account>;
  transfers: Record<string, Stripe.Transfer>;
  transfer_reversals: Record<string, Stripe.TransferReversal>;
  events: Record<string, FakeEvent>;
  /** Test behaviour of each card PaymentMethod (never the number). */
  card_behaviour: Record<string, CardBehaviour>;
  /** Per PaymentIntent: where a finished authentication sends the buyer. */
  return_urls: Record<string, string>;
  /** Per PaymentIntent in requires_action: the id of its one pending test authentication. */
  authentications: Record<string, string>;
  idempotency: Record<string, IdempotencyRecord>;
  deliveries: Record<string, Delivery>;
};

/** An empty state. */
export function emptyState(): State {
  return {
    version: 1,
    payment_methods: {},
    payment_intents: {},
    charges: {},
    refunds: {},
    balance_transactions: {},
    accounts: {},
    transfers: {},
    transfer_reversals: {},
    events: {},
    card_behaviour: {},
    return_urls: {},
    authentications: {},
    idempotency: {},
    deliveries: {},
  };
}

function alive(pid: number): boolean {
  try {
    process.kill(pid, 0); // signal 0 only asks whether the process exists
    return true;
  } catch (e) {
    return (e as NodeJS.ErrnoException).code === "EPERM";
  }
}

/** Loads and saves the state file; holds the directory's lock while open. */
export class Store {
  state: State;
  private readonly file: string;
  private readonly lockFile: string;
  private locked = false;

  constructor(readonly dir: string) {
    this.file = path.join(dir, "state.json");
    this.lockFile = path.join(dir, "lock");
    mkdirSync(dir, { recursive: true });
    this.lock();
    try {
      this.state = this.load();
    } catch (e) {
      this.unlock();
      throw e;
    }
  }

  private lock(): void {
    try {
      writeFileSync(this.lockFile, String(process.pid), { flag: "wx" });
    } catch (e) {
      if ((e as NodeJS.ErrnoException).code !== "EEXIST") throw e;
      const holder = Number(readFileSync(this.lockFile, "utf8").trim());
      if (Number.isInteger(holder) && holder > 0 && alive(holder)) {
        throw new Error(`stripe-fake: ${this.dir} is in use by process ${holder} (another fake, or one not closed)`);
      }
      writeFileSync(this.lockFile, String(process.pid)); // left by a process that is gone
    }
    this.locked = true;
  }

  private load(): State {
    let text: string;
    try {
      text = readFileSync(this.file, "utf8");
    } catch (e) {
      if ((e as NodeJS.ErrnoException).code === "ENOENT") return emptyState();
      throw e;
    }
    const parsed = JSON.parse(text) as State; // a damaged file stops the start: never silently start empty
    if (parsed.version !== 1) throw new Error(`stripe-fake: unknown state version in ${this.file}`);
    return { ...emptyState(), ...parsed };
  }

  /** Writes the state: temporary file, fsync, rename over the old one. */
  save(): void {
    const tmp = `${this.file}.${process.pid}.tmp`;
    const fd = openSync(tmp, "w", 0o600);
    try {
      writeSync(fd, JSON.stringify(this.state));
      fsyncSync(fd);
    } finally {
      closeSync(fd);
    }
    renameSync(tmp, this.file);
  }

  /** Releases the directory lock. */
  unlock(): void {
    if (!this.locked) return;
    this.locked = false;
    rmSync(this.lockFile, { force: true });
  }
}
