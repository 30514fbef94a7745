"use client";

import { signOut } from "next-auth/react";

export function SignOutButton() {
  return (
    <button type="button" onClick={() => signOut({ callbackUrl: "/signin" })}
      className="rounded-md border border-line-strong px-3 py-1.5 text-sm hover:bg-paper-sunk">
      Sign out
    </button>
  );
}
