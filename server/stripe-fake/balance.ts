// GET /v1/balance (the platform's, or a connected account's with the Stripe-Account header) and the
// platform's balance transactions.
import type { Handler } from "./context";
import { FakeError, noSuch } from "./errors";
import { balanceObject, connectedAvailable, platformAvailable } from "./ledger";
import { LIST_PARAMS, page } from "./lists";
import { onlyParams, str } from "./params";

/** GET /v1/balance */
export const retrieveBalance: Handler = (ctx) => {
  onlyParams(ctx.params, ["expand"]);
  if (ctx.stripeAccount) {
    if (!ctx.state.accounts[ctx.stripeAccount]) {
      throw new FakeError(403, {
        type: "invalid_request_error",
        code: "account_invalid",
        message: `The provided key does not have access to account '${ctx.stripeAccount}' (or that account does not exist).`,
      });
    }
    return balanceObject(connectedAvailable(ctx.state, ctx.stripeAccount), false);
  }
  return balanceObject(platformAvailable(ctx.state), true);
};

/** GET /v1/balance_transactions — filters type, source, currency. */
export const listBalanceTransactions: Handler = (ctx) => {
  const p = ctx.params;
  onlyParams(p, [...LIST_PARAMS, "type", "source", "currency", "payout"]);
  const type = str(p, "type");
  const source = str(p, "source");
  const currency = str(p, "currency")?.toLowerCase();
  const items = Object.values(ctx.state.balance_transactions).filter(
    (t) =>
      (type === undefined || t.type === type) &&
      (source === undefined || t.source === source) &&
      (currency === undefined || t.currency === currency),
  );
  return page(items, p, "/v1/balance_transactions");
};

/** GET /v1/balance_transactions/:id */
export const retrieveBalanceTransaction: Handler = (ctx, id) => {
  onlyParams(ctx.params, ["expand"]);
  const t = ctx.state.balance_transactions[id];
  if (!t) throw noSuch("balance transaction", id);
  return t;
};
