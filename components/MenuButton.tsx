"use client";

import Link from "next/link";
import { usePathname } from "next/navigation";
import { useState } from "react";

/** The header's links behind one button on narrow screens; closes when a page is chosen or Escape is pressed. */
export function MenuButton({
  items,
  children,
}: {
  items: { href: string; label: string }[];
  children?: React.ReactNode;
}) {
  // The menu stays open only on the page it was opened on: choosing a page closes it.
  const path = usePathname();
  const [openOn, setOpenOn] = useState<string | null>(null);
  const open = openOn === path;
  const setOpen = (next: boolean) => setOpenOn(next ? path : null);
  return (
    <div
      className="md:hidden"
      onKeyDown={(e) => {
        if (e.key === "Escape") setOpen(false);
      }}
    >
      <button
        type="button"
        className="btn-quiet min-h-10 px-3"
        aria-expanded={open}
        aria-controls="phone-menu"
        onClick={() => setOpen(!open)}
      >
        <span aria-hidden="true" className="mr-1">
          ≡
        </span>
        Menu
      </button>
      {open ? (
        <nav
          id="phone-menu"
          aria-label="Main"
          className="absolute inset-x-0 top-full z-30 border-b border-flash-200 bg-white px-4 py-2 shadow-md"
        >
          <ul className="divide-y divide-flash-100">
            {items.map((i) => (
              <li key={i.href}>
                <Link href={i.href} className="block py-3 text-flash-800">
                  {i.label}
                </Link>
              </li>
            ))}
          </ul>
          {children}
        </nav>
      ) : null}
    </div>
  );
}
