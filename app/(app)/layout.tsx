import type { ReactNode } from "react";
import Link from "next/link";
import { requireViewer } from "@/lib/auth/session";
import { navigationFor } from "@/lib/auth/permissions";
import { ROLE_LABELS } from "@/lib/auth/roles";
import { Logo } from "@/components/ui/logo";
import { SignOutButton } from "./sign-out-button";

export default async function AppLayout({ children }: { children: ReactNode }) {
  const viewer = await requireViewer();
  const nav = navigationFor(viewer.principal);
  const roles = [...new Set([...viewer.firms.map((f) => f.role), ...viewer.clientRoles])].map((r) => ROLE_LABELS[r]);
  return (
    <div className="min-h-screen">
      <header className="border-b border-line bg-paper-raised">
        <div className="mx-auto flex max-w-7xl flex-wrap items-center gap-x-6 gap-y-2 px-gutter py-3">
          <Link href="/projects" className="text-lg text-ink" aria-label="LoopLedger home">
            <Logo />
          </Link>
          <nav aria-label="Main" data-testid="main-nav" className="flex flex-wrap gap-1">
            {nav.map((item) => (
              <Link key={item.href} href={item.href} className="rounded-md px-3 py-1.5 text-sm text-ink-soft hover:bg-paper-sunk hover:text-ink">
                {item.label}
              </Link>
            ))}
          </nav>
          <div className="ml-auto flex items-center gap-3 text-sm">
            <span className="text-ink-soft">
              <span className="font-medium text-ink" data-testid="viewer-name">{viewer.name}</span>
              {roles.length > 0 && <span data-testid="viewer-roles"> · {roles.join(", ")}</span>}
              {viewer.firms[0] && <span className="hidden md:inline"> · {viewer.firms[0].firmName}</span>}
            </span>
            <SignOutButton />
          </div>
        </div>
      </header>
      <main className="mx-auto max-w-7xl px-gutter py-8">{children}</main>
      <footer className="mx-auto max-w-7xl px-gutter pb-8 text-xs text-ink-faint">
        LoopLedger results are screening estimates. Equipment ratings must come from certified manufacturer selections;
        local codes, the authority having jurisdiction and a licensed engineer govern design and operation.
      </footer>
    </div>
  );
}
