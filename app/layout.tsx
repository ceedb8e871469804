import type { Metadata, Viewport } from "next";
import localFont from "next/font/local";
import { connection } from "next/server";
import type { ReactNode } from "react";
import { SiteHeader } from "@/components/shell/site-header";
import "./globals.css";

// Shipped in fonts/ (SIL Open Font License); nothing is downloaded at build or run time.
const body = localFont({
  src: [
    { path: "../fonts/atkinson-hyperlegible-latin-400-normal.woff2", weight: "400", style: "normal" },
    { path: "../fonts/atkinson-hyperlegible-latin-400-italic.woff2", weight: "400", style: "italic" },
    { path: "../fonts/atkinson-hyperlegible-latin-700-normal.woff2", weight: "700", style: "normal" },
  ],
  variable: "--font-body",
  display: "swap",
});
const display = localFont({
  src: [{ path: "../fonts/fraunces-latin-600-normal.woff2", weight: "600", style: "normal" }],
  variable: "--font-display",
  display: "swap",
});

export const metadata: Metadata = {
  title: { default: "Darnwell", template: "%s · Darnwell" },
  description: "Commissions, charts, quotes, proofs and hours for hand-knitting studios.",
};

export const viewport: Viewport = { width: "device-width", initialScale: 1, themeColor: "#FBF8F2" };

export default async function RootLayout({ children }: { children: ReactNode }) {
  await connection(); // every page per request: the CSP nonce (proxy.ts) is new each time
  return (
    <html lang="en-GB" className={`${body.variable} ${display.variable}`}>
      <body className="flex min-h-screen flex-col">
        <a
          href="#main"
          className="sr-only focus:not-sr-only focus:absolute focus:left-2 focus:top-2 focus:z-50 focus:bg-white focus:p-3"
        >
          Skip to content
        </a>
        <SiteHeader />
        <main id="main" className="mx-auto w-full max-w-5xl flex-1 px-4 py-8 sm:px-6">
          {children}
        </main>
        <footer className="border-t border-bark/20 px-4 py-6 text-center text-sm text-bark">
          Darnwell · commissions for hand-knitting studios
        </footer>
      </body>
    </html>
  );
}
