// List pages ({ object: "list", data, has_more, url }) with limit / starting_after / ending_before / created,
// and `expand` of id fields into the objects they name.
import { invalid, noSuch } from "./errors";
import type { ParamHash } from "./form";
import { hash, int, str } from "./params";
import type { State } from "./store";

/** Parameters every list endpoint accepts. */
export const LIST_PARAMS = ["limit", "starting_after", "ending_before", "created", "expand"] as const;

/** A Stripe list page. */
export type ListPage<T> = { object: "list"; data: T[]; has_more: boolean; url: string };

function createdFilter(p: ParamHash): (created: number) => boolean {
  if (p.created === undefined) return () => true;
  if (typeof p.created === "string") {
    const at = int(p, "created");
    return (c) => c === at;
  }
  const range = hash(p, "created") ?? {};
  const bounds: Array<[string, (a: number, b: number) => boolean]> = [
    ["gt", (c, b) => c > b],
    ["gte", (c, b) => c >= b],
    ["lt", (c, b) => c < b],
    ["lte", (c, b) => c <= b],
  ];
  for (const k of Object.keys(range)) {
    if (!bounds.some(([name]) => name === k))
      throw invalid(`Received unknown parameter: created[${k}]`, `created[${k}]`, "parameter_unknown");
  }
  const checks = bounds.flatMap(([name, cmp]) => {
    const b = int(range, name, {}, "created");
    return b === undefined ? [] : [(c: number) => cmp(c, b)];
  });
  return (c) => checks.every((f) => f(c));
}

/** Pages `items` (given oldest first, as stored); answers newest first, as Stripe does. */
export function page<T extends { id: string; created?: number }>(items: T[], p: ParamHash, url: string): ListPage<T> {
  const limit = int(p, "limit", { min: 1, max: 100 }) ?? 10;
  const after = str(p, "starting_after");
  const before = str(p, "ending_before");
  if (after && before)
    throw invalid("You may only specify one of these parameters: starting_after, ending_before.", "ending_before");
  const keep = createdFilter(p);
  const all = items.filter((x) => keep(x.created ?? 0)).reverse();
  if (before) {
    const i = all.findIndex((x) => x.id === before);
    if (i === -1) throw noSuch("object", before, "ending_before", 400);
    const start = Math.max(0, i - limit);
    return { object: "list", data: all.slice(start, i), has_more: start > 0, url };
  }
  let start = 0;
  if (after) {
    const i = all.findIndex((x) => x.id === after);
    if (i === -1) throw noSuch("object", after, "starting_after", 400);
    start = i + 1;
  }
  const data = all.slice(start, start + limit);
  return { object: "list", data, has_more: start + limit < all.length, url };
}

const PREFIXES: Array<[string, keyof State]> = [
  ["pi_", "payment_intents"],
  ["ch_", "charges"],
  ["pm_", "payment_methods"],
  ["txn_", "balance_transactions"],
  ["acct_", "accounts"],
  ["trr_", "transfer_reversals"],
  ["tr_", "transfers"],
  ["re_", "refunds"],
  ["evt_", "events"],
];

/** The stored object an id names, or undefined. */
export function lookup(state: State, id: string): object | undefined {
  const hit = PREFIXES.find(([prefix]) => id.startsWith(prefix));
  if (!hit) return undefined;
  return (state[hit[1]] as Record<string, object>)[id];
}

function expandPath(state: State, target: Record<string, unknown>, segs: string[], full: string): void {
  const [head, ...rest] = segs;
  if (!(head in target)) throw invalid(`This property cannot be expanded (${full}).`, "expand");
  let value = target[head];
  if (typeof value === "string") {
    const found = lookup(state, value);
    if (found) {
      value = structuredClone(found);
      target[head] = value;
    } else if (rest.length === 0) {
      return; // an id the fake keeps no object for (py_…): left as the id
    }
  }
  if (rest.length === 0 || value === null) return;
  if (typeof value !== "object") throw invalid(`This property cannot be expanded (${full}).`, "expand");
  if (Array.isArray(value)) throw invalid(`This property cannot be expanded (${full}).`, "expand");
  expandPath(state, value as Record<string, unknown>, rest, full);
}

/** Applies `expand` paths to a response (already a copy). On lists, paths start with `data.`. */
export function expand(state: State, body: Record<string, unknown>, paths: string[]): void {
  for (const path of paths) {
    const segs = path.split(".");
    if (segs.length > 4 || segs.some((s) => !s)) throw invalid(`Invalid expand path: ${path}`, "expand");
    if (body.object === "list" && Array.isArray(body.data)) {
      if (segs[0] !== "data" || segs.length < 2) throw invalid(`This property cannot be expanded (${path}).`, "expand");
      for (const item of body.data as Array<Record<string, unknown>>) expandPath(state, item, segs.slice(1), path);
    } else {
      expandPath(state, body, segs, path);
    }
  }
}
