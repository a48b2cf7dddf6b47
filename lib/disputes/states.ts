/**
 * Where a claim stands, as a closed list, and the moves between states the
 * exchange allows [SUG: our own names and flow]. Services take a step with a
 * guarded update (`… WHERE state IN (:from)`) whose `from` comes from this
 * table, so no step can skip or undo one.
 */
import type { DisputeState } from "./rules";

/** Every state a claim can be in, in the order a case usually passes through them. */
export const DISPUTE_STATES = [
  "awaiting-answer",
  "answered",
  "with-mediator",
  "settling",
  "awaiting-return",
  "closed",
] as const satisfies readonly DisputeState[];

/** The steps that move a claim from one state to another. */
export type DisputeStep = "answer" | "take" | "decide" | "await-return" | "close";

/** For each step: the states it may start from and the state it leads to [SUG]. */
export const DISPUTE_TRANSITIONS: Readonly<
  Record<DisputeStep, { readonly from: readonly DisputeState[]; readonly to: DisputeState }>
> = {
  /** The consignor's first message (a mediator who already took the case keeps it). */
  answer: { from: ["awaiting-answer"], to: "answered" },
  /** A mediator takes the case from the queue; taking it again is a retry. */
  take: { from: ["awaiting-answer", "answered", "with-mediator"], to: "with-mediator" },
  /** The case's mediator records a decision; the money then moves. */
  decide: { from: ["with-mediator"], to: "settling" },
  /** A refund-on-return decision waits for the lot to come back. */
  "await-return": { from: ["settling"], to: "awaiting-return" },
  /** The money has moved (or the return was settled or abandoned). */
  close: { from: ["settling", "awaiting-return"], to: "closed" },
};

/** The states a step may start from. */
export function statesBefore(step: DisputeStep): DisputeState[] {
  return [...DISPUTE_TRANSITIONS[step].from];
}

/** True when some step leads from `from` to `to` (a step that keeps the state, such as a retried take, counts). */
export function canMove(from: DisputeState, to: DisputeState): boolean {
  return Object.values(DISPUTE_TRANSITIONS).some((t) => t.to === to && t.from.includes(from));
}

/** True while a claim is still open to messages and evidence. */
export function isOpenState(state: DisputeState): boolean {
  return state !== "closed";
}

/** True when the state is one of {@link DISPUTE_STATES} (for rows read back from the database). */
export function isDisputeState(value: string): value is DisputeState {
  return (DISPUTE_STATES as readonly string[]).includes(value);
}
