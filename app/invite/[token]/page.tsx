import type { Metadata } from "next";
import type { ReactNode } from "react";
import Link from "next/link";
import { perform } from "@/lib/actions/request";
import { currentViewer } from "@/lib/auth/session";
import { ROLE_LABELS } from "@/lib/auth/roles";
import { inspectInvitation } from "@/lib/sharing/acceptance";
import { formatWhen } from "@/lib/dates";
import { Logo } from "@/components/ui/logo";
import { AcceptSignedInForm, NewAccountForm } from "./invite-forms";

// The token is in this page's address: keep it out of Referer headers and search indexes.
export const metadata: Metadata = { title: "Invitation", referrer: "no-referrer", robots: { index: false, follow: false } };

function Card({ title, children }: { title: string; children: ReactNode }) {
  return (
    <main className="flex min-h-screen items-center justify-center bg-paper-sunk px-4 py-10">
      <div className="w-full max-w-md">
        <div className="mb-6 text-center text-2xl text-ink">
          <Logo />
        </div>
        <div className="rounded-panel border border-line bg-paper-raised p-panel shadow-panel">
          <h1 className="mb-3 text-lg font-semibold">{title}</h1>
          {children}
        </div>
      </div>
    </main>
  );
}

/** The link from an invitation e-mail: accept (new account or existing one), or a clear refusal. */
export default async function InvitePage({ params }: { params: Promise<{ token: string }> }) {
  const { token } = await params;
  const link = await perform(inspectInvitation, token);
  if (link.state !== "open") {
    const title = { unknown: "This link does not work", accepted: "This invitation was already used", revoked: "This invitation was withdrawn", expired: "This invitation has expired" }[link.state];
    return (
      <Card title={title}>
        <p className="text-sm text-ink-soft" data-testid="invite-refused" data-state={link.state}>
          {link.message}
        </p>
        <p className="mt-4 text-sm">
          <Link href="/signin" className="text-basin-700 underline">
            Go to sign-in
          </Link>
        </p>
      </Card>
    );
  }

  const viewer = await currentViewer();
  const intro = (
    <div className="mb-5 space-y-2 text-sm text-ink-soft" data-testid="invite-intro">
      <p>
        {link.inviterName ?? "A consultant"} of <strong className="text-ink">{link.firmName}</strong> invites{" "}
        <strong className="text-ink">{link.email}</strong> to the project <strong className="text-ink">{link.projectName}</strong> as{" "}
        {ROLE_LABELS[link.role]}.
      </p>
      <p className="text-xs text-ink-faint">The link works once, until {formatWhen(link.expiresAt)}.</p>
    </div>
  );
  const signedInAsOther = viewer && viewer.email.toLowerCase() !== link.email.toLowerCase();

  if (signedInAsOther) {
    return (
      <Card title="Accept the invitation">
        {intro}
        <p className="text-sm" data-testid="invite-wrong-account">
          You are signed in as {viewer.email}. This invitation is for {link.email}: sign out first, then open the link again.
        </p>
      </Card>
    );
  }
  if (!link.accountExists) {
    return (
      <Card title="Accept the invitation">
        {intro}
        <NewAccountForm token={token} email={link.email} />
      </Card>
    );
  }
  if (viewer) {
    return (
      <Card title="Accept the invitation">
        {intro}
        <AcceptSignedInForm token={token} />
      </Card>
    );
  }
  return (
    <Card title="Accept the invitation">
      {intro}
      <p className="text-sm">There is an account for {link.email}. Sign in with it and you come back here to accept.</p>
      <Link
        href={`/signin?callbackUrl=${encodeURIComponent(`/invite/${token}`)}`}
        className="mt-4 inline-flex w-full justify-center rounded-md bg-basin-600 px-3 py-2 font-medium text-white hover:bg-basin-700"
        data-testid="invite-signin"
      >
        Sign in as {link.email}
      </Link>
    </Card>
  );
}
