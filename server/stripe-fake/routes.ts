// The /v1 route table of the local Stripe fake.
import { createAccount, listAccounts, retrieveAccount, updateAccount } from "./accounts";
import { listBalanceTransactions, retrieveBalance, retrieveBalanceTransaction } from "./balance";
import { listCharges, retrieveCharge } from "./charges";
import type { Route } from "./context";
import { listEvents, retrieveEvent } from "./events";
import {
  cancelPaymentIntent,
  capturePaymentIntent,
  confirmPaymentIntent,
  createPaymentIntent,
  listPaymentIntents,
  retrievePaymentIntent,
  updatePaymentIntent,
} from "./payment-intents";
import { createPaymentMethod, retrievePaymentMethod } from "./payment-methods";
import { createRefund, listRefunds, retrieveRefund } from "./refunds";
import {
  createReversal,
  createTransfer,
  listReversals,
  listTransfers,
  retrieveReversal,
  retrieveTransfer,
  updateTransfer,
} from "./transfers";

const ID = "([A-Za-z0-9_]+)";
const r = (s: string) => new RegExp(`^/v1/${s.replaceAll(":id", ID)}$`);

/** Every /v1 endpoint the fake serves. */
export const ROUTES: Route[] = [
  { method: "POST", pattern: r("payment_methods"), handler: createPaymentMethod },
  { method: "GET", pattern: r("payment_methods/:id"), handler: retrievePaymentMethod },

  { method: "POST", pattern: r("payment_intents"), handler: createPaymentIntent },
  { method: "GET", pattern: r("payment_intents"), handler: listPaymentIntents },
  { method: "GET", pattern: r("payment_intents/:id"), handler: retrievePaymentIntent },
  { method: "POST", pattern: r("payment_intents/:id"), handler: updatePaymentIntent },
  { method: "POST", pattern: r("payment_intents/:id/confirm"), handler: confirmPaymentIntent },
  { method: "POST", pattern: r("payment_intents/:id/capture"), handler: capturePaymentIntent },
  { method: "POST", pattern: r("payment_intents/:id/cancel"), handler: cancelPaymentIntent },

  { method: "GET", pattern: r("charges"), handler: listCharges },
  { method: "GET", pattern: r("charges/:id"), handler: retrieveCharge },

  { method: "POST", pattern: r("refunds"), handler: createRefund },
  { method: "GET", pattern: r("refunds"), handler: listRefunds },
  { method: "GET", pattern: r("refunds/:id"), handler: retrieveRefund },

  { method: "POST", pattern: r("accounts"), handler: createAccount },
  { method: "GET", pattern: r("accounts"), handler: listAccounts },
  { method: "GET", pattern: r("accounts/:id"), handler: retrieveAccount },
  { method: "POST", pattern: r("accounts/:id"), handler: updateAccount },

  { method: "POST", pattern: r("transfers"), handler: createTransfer },
  { method: "GET", pattern: r("transfers"), handler: listTransfers },
  { method: "GET", pattern: r("transfers/:id"), handler: retrieveTransfer },
  { method: "POST", pattern: r("transfers/:id"), handler: updateTransfer },
  { method: "POST", pattern: r("transfers/:id/reversals"), handler: createReversal },
  { method: "GET", pattern: r("transfers/:id/reversals"), handler: listReversals },
  { method: "GET", pattern: r("transfers/:id/reversals/:id"), handler: retrieveReversal },

  { method: "GET", pattern: r("balance"), handler: retrieveBalance, account: true },
  { method: "GET", pattern: r("balance_transactions"), handler: listBalanceTransactions },
  { method: "GET", pattern: r("balance_transactions/:id"), handler: retrieveBalanceTransaction },

  { method: "GET", pattern: r("events"), handler: listEvents },
  { method: "GET", pattern: r("events/:id"), handler: retrieveEvent },
];
