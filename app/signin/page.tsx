import type { Metadata } from "next";
import { redirect } from "next/navigation";
import { currentViewer } from "@/lib/auth/session";
import { Logo } from "@/components/ui/logo";
import { SignInForm } from "./sign-in-form";

export const metadata: Metadata = { title: "Sign in" };

function safeCallback(raw: string | string[] | undefined): string {
  const v = Array.isArray(raw) ? raw[0] : raw;
  return v && v.startsWith("/") && !v.startsWith("//") ? v : "/projects";
}

export default async function SignInPage({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  const params = await searchParams;
  const callbackUrl = safeCallback(params.callbackUrl);
  if (await currentViewer()) redirect(callbackUrl);
  return (
    <main className="flex min-h-screen items-center justify-center bg-paper-sunk px-4">
      <div className="w-full max-w-sm">
        <div className="mb-6 text-center text-2xl text-ink">
          <Logo />
          <p className="mt-2 text-sm text-ink-soft">Condenser heat rejection, costed over its life.</p>
        </div>
        <div className="rounded-panel border border-line bg-paper-raised p-panel shadow-panel">
          <h1 className="mb-4 text-lg font-semibold">Sign in</h1>
          <SignInForm callbackUrl={callbackUrl} initialError={params.error ? "signin" : undefined} />
        </div>
      </div>
    </main>
  );
}
