import Link from "next/link";
import type { Viewer } from "@/lib/auth/guards";
import { can, ROLE_LABEL } from "@/lib/auth/roles";
import { Mark } from "./Mark";
import { NoticeBell } from "./live/NoticeBell";
import { MenuButton } from "./MenuButton";
import { SignOutButton } from "./SignOutButton";

type NavItem = { href: string; label: string };

/** Navigation for what the viewer's roles allow; later features add their links here. */
export function navFor(viewer: Viewer | null): NavItem[] {
  const items: NavItem[] = [
    { href: "/catalogue", label: "Catalogue" },
    { href: "/reference", label: "Valve reference" },
  ];
  if (!viewer) return items;
  items.push({ href: "/sales", label: "Sales" });
  items.push({ href: "/lots", label: "Lots" });
  items.push({ href: "/invoices", label: "Invoices" });
  if (can(viewer.roles, "lots.consign") || can(viewer.roles, "lots.bid"))
    items.push({ href: "/disputes", label: "Claims" });
  if (can(viewer.roles, "lots.consign")) items.push({ href: "/consignor", label: "My consignments" });
  if (can(viewer.roles, "lots.bid"))
    items.push({ href: "/dealer", label: "Dealer desk" }, { href: "/dealer/want-lists", label: "Want lists" });
  if (can(viewer.roles, "shelf.use")) items.push({ href: "/shelf", label: "Unconfirmed shelf" });
  if (can(viewer.roles, "disputes.mediate")) items.push({ href: "/mediation", label: "Mediation" });
  if (can(viewer.roles, "house.manage")) {
    items.push({ href: "/house/review", label: "Review queue" });
    items.push({ href: "/house", label: "House desk" });
  }
  return items;
}

/** The site header: brand, links and the viewer's corner; below 768 px the links fold behind a menu button. */
export function SiteHeader({ viewer }: { viewer: Viewer | null }) {
  const items = navFor(viewer);
  return (
    <header className="relative border-b border-flash-200 bg-white print:hidden">
      <div className="mx-auto flex max-w-6xl items-center gap-x-6 gap-y-2 px-4 py-3 md:flex-wrap">
        <Link href="/" className="flex items-center gap-2 font-semibold text-flash-900">
          <Mark />
          <span className="text-lg tracking-tight">Getterline</span>
        </Link>
        <nav aria-label="Main" className="hidden flex-1 flex-wrap gap-x-4 gap-y-1 text-sm md:flex">
          {items.map((i) => (
            <Link
              key={i.href}
              href={i.href}
              className="text-flash-700 underline-offset-4 hover:text-flash-900 hover:underline"
            >
              {i.label}
            </Link>
          ))}
        </nav>
        {viewer ? (
          <div className="ml-auto flex items-center gap-3 text-sm md:ml-0">
            <span className="hidden text-flash-700 md:inline">
              {viewer.name}{" "}
              <span className="text-flash-500">· {viewer.roles.map((r) => ROLE_LABEL[r]).join(", ")}</span>
            </span>
            <NoticeBell />
            <span className="hidden md:inline">
              <SignOutButton />
            </span>
            <MenuButton items={items}>
              <p className="py-3 text-flash-700">
                {viewer.name} · <SignOutButton />
              </p>
            </MenuButton>
          </div>
        ) : (
          <div className="ml-auto flex items-center gap-3 text-sm md:ml-0">
            <Link href="/sign-in" className="whitespace-nowrap text-flash-800 underline-offset-4 hover:underline">
              Sign in
            </Link>
            <span className="hidden sm:inline">
              <Link href="/sign-up" className="btn-primary whitespace-nowrap">
                Open an account
              </Link>
            </span>
            <MenuButton items={items}>
              <p className="py-3">
                <Link href="/sign-up" className="btn-primary">
                  Open an account
                </Link>
              </p>
            </MenuButton>
          </div>
        )}
      </div>
    </header>
  );
}
