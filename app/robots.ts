// GET /robots.txt — crawlers may read the public catalogue, lot pages and the reference; never the API,
// the desks, the house's pages or anything behind sign-in
import type { MetadataRoute } from "next";

/** Paths behind sign-in (or a personal link) that no crawler should ask for. */
export const PRIVATE_PATHS = [
  "/api/",
  "/house",
  "/consignor",
  "/dealer",
  "/mediation",
  "/invoices",
  "/disputes",
  "/shelf",
  "/sales",
  "/lots$",
  "/want-lists",
  "/forgot-password",
  "/reset-password",
  "/confirm-email",
  "/forbidden",
];

export default function robots(): MetadataRoute.Robots {
  return {
    rules: [
      { userAgent: "*", allow: ["/", "/catalogue", "/lots/", "/reference", "/cautions"], disallow: PRIVATE_PATHS },
    ],
  };
}
