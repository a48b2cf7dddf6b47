/**
 * Roles and what each may do: the one table every guard reads (route handlers,
 * server actions, page layouts and the socket.io handshake).
 */
export const ROLES = ["consignor", "dealer", "mediator", "admin"] as const;
export type Role = (typeof ROLES)[number];

/** Roles a person may pick at sign-up; the house grants the others. */
export const SELF_SERVICE_ROLES = ["consignor", "dealer"] as const satisfies readonly Role[];

export const PERMISSIONS = {
  "account.read": ["consignor", "dealer", "mediator", "admin"],
  "lots.consign": ["consignor"],
  "lots.bid": ["dealer"],
  "address.keep": ["consignor", "dealer"],
  "shelf.use": ["dealer", "admin", "mediator"],
  "disputes.mediate": ["mediator"],
  "house.manage": ["admin"],
  "users.manage": ["admin"],
  "reference.edit": ["admin"],
} as const satisfies Record<string, readonly Role[]>;

export type Permission = keyof typeof PERMISSIONS;

/** True when any of the roles grants the permission. */
export function can(roles: readonly Role[], permission: Permission): boolean {
  const allowed: readonly Role[] = PERMISSIONS[permission];
  return roles.some((r) => allowed.includes(r));
}

/** Where each role lands after sign-in, in order of precedence. */
export const ROLE_HOME: Record<Role, string> = {
  admin: "/house",
  mediator: "/mediation",
  dealer: "/dealer",
  consignor: "/consignor",
};

export const ROLE_LABEL: Record<Role, string> = {
  consignor: "Consignor",
  dealer: "Dealer",
  mediator: "Mediator",
  admin: "House",
};

/** The home for a person holding these roles (the first in precedence order). */
export function homeFor(roles: readonly Role[]): string {
  for (const r of ["admin", "mediator", "dealer", "consignor"] as const) if (roles.includes(r)) return ROLE_HOME[r];
  return "/";
}
