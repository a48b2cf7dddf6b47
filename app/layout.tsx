import type { Metadata } from "next";
import Link from "next/link";
import { Providers } from "@/components/providers";
import { SiteHeader } from "@/components/SiteHeader";
import { currentViewer } from "@/lib/auth/guards";
import { mono, sans } from "./fonts";
import "./globals.css";

export const metadata: Metadata = {
  title: { default: "Getterline", template: "%s · Getterline" },
  description: "A live exchange for wholesale lots of vintage vacuum tubes, with the evidence to bid on them.",
};

/**
 * Every page is rendered per request: the header shows who is signed in, and pages read live lots and prices.
 * (Without this a page with no other request data would be prerendered at build time, signed out, and with
 * the database of the build machine.)
 */
export const dynamic = "force-dynamic";

export default async function RootLayout({ children }: { children: React.ReactNode }) {
  const viewer = await currentViewer().catch(() => null);
  return (
    <html lang="en" className={`${sans.variable} ${mono.variable}`}>
      <body className="flex min-h-screen flex-col">
        <a
          href="#main"
          className="sr-only focus:not-sr-only focus:absolute focus:left-2 focus:top-2 focus:rounded focus:bg-white focus:px-3 focus:py-2"
        >
          Skip to content
        </a>
        <Providers>
          <SiteHeader viewer={viewer} />
          <main id="main" className="mx-auto w-full max-w-6xl flex-1 px-4 py-8">
            {children}
          </main>
        </Providers>
        <footer className="border-t border-flash-200 bg-white print:hidden">
          <div className="mx-auto flex max-w-6xl flex-wrap gap-x-6 gap-y-2 px-4 py-4 text-sm text-flash-600">
            <span>Getterline Exchange</span>
            <Link href="/cautions" className="underline underline-offset-2">
              Safety cautions: high voltage, glass and hazardous materials
            </Link>
            <Link href="/reference" className="underline underline-offset-2">
              Valve reference
            </Link>
          </div>
        </footer>
      </body>
    </html>
  );
}
