// Connected accounts: POST /v1/accounts (type custom | express | standard), GET one, POST update, GET list.
// The fake verifies nobody: requested capabilities are active at once and nothing is ever due.
// Onboarding details (individual, company, tos_acceptance, external_account, settings) are accepted and ignored.
import type Stripe from "stripe";
import type { Handler } from "./context";
import { invalid, noSuch } from "./errors";
import type { ParamHash } from "./form";
import { newId } from "./ids";
import { LIST_PARAMS, page } from "./lists";
import { applyMetadata, bool, hash, onlyParams, oneOf, str } from "./params";

const IGNORED = ["individual", "company", "tos_acceptance", "external_account", "settings", "documents"];
const PROFILE_FIELDS = [
  "name",
  "url",
  "mcc",
  "product_description",
  "support_email",
  "support_phone",
  "support_url",
] as const;

function capabilities(p: ParamHash, existing: Stripe.Account.Capabilities = {}): Stripe.Account.Capabilities {
  const caps = hash(p, "capabilities");
  const out: Record<string, string> = { ...(existing as Record<string, string>) };
  if (!caps) return out as Stripe.Account.Capabilities;
  for (const name of Object.keys(caps)) {
    const c = hash(caps, name, "capabilities") ?? {};
    onlyParams(c, ["requested"], `capabilities[${name}]`);
    const requested = bool(c, "requested", `capabilities[${name}]`);
    if (requested === true) out[name] = "active";
    if (requested === false) delete out[name];
  }
  return out as Stripe.Account.Capabilities;
}

function businessProfile(
  p: ParamHash,
  existing: Stripe.Account.BusinessProfile | null | undefined,
): Stripe.Account.BusinessProfile {
  const base: Stripe.Account.BusinessProfile = existing ?? {
    mcc: null,
    minority_owned_business_designation: null,
    name: null,
    specified_commercial_transactions_act_url: null,
    support_address: null,
    support_email: null,
    support_phone: null,
    support_url: null,
    url: null,
  };
  const bp = hash(p, "business_profile");
  if (!bp) return base;
  onlyParams(bp, [...PROFILE_FIELDS], "business_profile");
  const out = { ...base } as Record<string, unknown>;
  for (const f of PROFILE_FIELDS) {
    const v = str(bp, f, "business_profile");
    if (v !== undefined) out[f] = v || null;
  }
  return out as unknown as Stripe.Account.BusinessProfile;
}

/** POST /v1/accounts */
export const createAccount: Handler = (ctx) => {
  const p = ctx.params;
  onlyParams(p, [
    "type",
    "controller",
    "country",
    "email",
    "business_type",
    "business_profile",
    "capabilities",
    "default_currency",
    "metadata",
    "expand",
    ...IGNORED,
  ]);
  const type = oneOf(p, "type", ["custom", "express", "standard"] as const);
  const controller = hash(p, "controller");
  if (!type && !controller) throw invalid("Missing required param: type (or controller).", "type", "parameter_missing");
  const country = (str(p, "country") ?? "US").toUpperCase();
  if (!/^[A-Z]{2}$/.test(country)) throw invalid(`Invalid country: ${country}`, "country", "country_code_invalid");
  const defaultCurrency = (str(p, "default_currency") ?? "usd").toLowerCase();
  if (!/^[a-z]{3}$/.test(defaultCurrency)) throw invalid(`Invalid currency: ${defaultCurrency}`, "default_currency");
  const effectiveType = type ?? "custom";
  const account: Stripe.Account = {
    id: newId("acct"),
    object: "account",
    business_profile: businessProfile(p, null),
    business_type:
      oneOf(p, "business_type", ["company", "government_entity", "individual", "non_profit"] as const) ?? null,
    capabilities: capabilities(p),
    charges_enabled: true,
    controller: {
      type: effectiveType === "standard" ? "account" : "application",
      is_controller: effectiveType !== "standard",
    },
    country,
    created: ctx.now,
    default_currency: defaultCurrency,
    details_submitted: true,
    email: str(p, "email") ?? null,
    external_accounts: { object: "list", data: [], has_more: false, url: "" },
    metadata: applyMetadata(p),
    payouts_enabled: true,
    requirements: {
      alternatives: [],
      current_deadline: null,
      currently_due: [],
      disabled_reason: null,
      errors: [],
      eventually_due: [],
      past_due: [],
      pending_verification: [],
    },
    settings: null,
    tos_acceptance: { date: null, ip: null, user_agent: null },
    type: effectiveType,
  };
  account.external_accounts = {
    object: "list",
    data: [],
    has_more: false,
    url: `/v1/accounts/${account.id}/external_accounts`,
  };
  ctx.state.accounts[account.id] = account;
  return account;
};

/** GET /v1/accounts/:id */
export const retrieveAccount: Handler = (ctx, id) => {
  onlyParams(ctx.params, ["expand"]);
  const account = ctx.state.accounts[id];
  if (!account) throw noSuch("account", id, "account");
  return account;
};

/** POST /v1/accounts/:id — email, business_profile, capabilities, metadata. */
export const updateAccount: Handler = (ctx, id) => {
  const p = ctx.params;
  onlyParams(p, ["email", "business_profile", "capabilities", "metadata", "expand", ...IGNORED]);
  const account = ctx.state.accounts[id];
  if (!account) throw noSuch("account", id, "account");
  const profile = businessProfile(p, account.business_profile);
  const caps = capabilities(p, account.capabilities);
  const metadata = applyMetadata(p, account.metadata ?? {});
  const email = str(p, "email");
  account.business_profile = profile;
  account.capabilities = caps;
  account.metadata = metadata;
  if (email !== undefined) account.email = email || null;
  return account;
};

/** GET /v1/accounts */
export const listAccounts: Handler = (ctx) => {
  onlyParams(ctx.params, [...LIST_PARAMS]);
  return page(Object.values(ctx.state.accounts), ctx.params, "/v1/accounts");
};
