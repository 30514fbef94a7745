import type { Metadata } from "next";
import { connection } from "next/server";
import type { ReactNode } from "react";
import { ZodJitless } from "@/components/system/zod-jitless";
import { plexMono, plexSans } from "./fonts";
import "./globals.css";

export const metadata: Metadata = {
  title: { default: "LoopLedger", template: "%s · LoopLedger" },
  description: "Open cooling tower or closed-circuit cooler: water, energy and life-cycle cost, compared.",
  // Files in public/ (scripts/make-icons.ts renders them from public/icon.svg).
  icons: {
    icon: [
      { url: "/favicon.ico", sizes: "16x16 32x32 48x48" },
      { url: "/icon.svg", type: "image/svg+xml" },
    ],
    apple: { url: "/apple-touch-icon.png", sizes: "180x180" },
  },
  manifest: "/site.webmanifest",
};

/** Rendered per request (never prerendered): Next.js puts each request's CSP nonce on its scripts (proxy.ts). */
export default async function RootLayout({ children }: { children: ReactNode }) {
  await connection();
  return (
    <html lang="en" className={`${plexSans.variable} ${plexMono.variable}`}>
      <body>
        <ZodJitless />
        {children}
      </body>
    </html>
  );
}
