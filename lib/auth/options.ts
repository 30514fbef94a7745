import type { NextAuthOptions } from "next-auth";
import CredentialsProvider from "next-auth/providers/credentials";
import { z } from "zod";
import { text } from "@/lib/validation/text";
import { db } from "@/db";
import { findUserByEmail, firmRolesOf, clientRolesOf } from "@/db/queries/users";
import { writeAudit } from "@/db/queries/audit";
import { env } from "@/lib/env";
import { verifyPassword } from "./password";
import {
  SIGN_IN_LIMITS,
  clientAddress,
  clearSignInFailures,
  isSignInBlocked,
  recordSignInFailure,
  signInKeys,
} from "./rate-limit";

const credentialsSchema = z.object({
  email: text().trim().email().max(320),
  password: text().min(1).max(200),
});

declare module "next-auth" {
  interface User {
    passwordChangedAtMs?: number;
  }
  interface Session {
    /** See lib/auth/session-rules.ts: sign-in time and the password's timestamp at sign-in. */
    authAtMs?: number;
    pwdAtMs?: number;
  }
}
declare module "next-auth/jwt" {
  interface JWT {
    authAtMs?: number;
    pwdAtMs?: number;
  }
}

/** next-auth configuration: e-mail + password, JWT sessions carrying the user id and roles. */
export const authOptions: NextAuthOptions = {
  secret: env().NEXTAUTH_SECRET,
  session: { strategy: "jwt", maxAge: env().SESSION_MAX_AGE_S },
  jwt: { maxAge: env().SESSION_MAX_AGE_S },
  pages: { signIn: "/signin", error: "/signin" },
  providers: [
    CredentialsProvider({
      name: "E-mail and password",
      credentials: { email: { label: "E-mail", type: "email" }, password: { label: "Password", type: "password" } },
      async authorize(credentials, req) {
        const parsed = credentialsSchema.safeParse(credentials);
        if (!parsed.success) return null;
        const { email, password } = parsed.data;
        const keys = signInKeys(email, clientAddress(req?.headers as Record<string, unknown> | undefined));
        if (await isSignInBlocked(db, [keys.account, keys.address])) return null;
        const user = await findUserByEmail(db, email);
        const ok = await verifyPassword(password, user?.password_hash);
        if (!user || !ok) {
          await recordSignInFailure(db, keys.account, SIGN_IN_LIMITS.account);
          await recordSignInFailure(db, keys.address, SIGN_IN_LIMITS.address);
          return null;
        }
        await clearSignInFailures(db, keys.account);
        await writeAudit(db, { actorId: user.id, action: "user.signIn" });
        return { id: user.id, email: user.email, name: user.name, passwordChangedAtMs: user.password_changed_at.getTime() };
      },
    }),
  ],
  callbacks: {
    async jwt({ token, user }) {
      if (user) {
        token.userId = user.id;
        token.authAtMs = Date.now();
        token.pwdAtMs = user.passwordChangedAtMs;
        const [firms, clients] = await Promise.all([firmRolesOf(db, user.id), clientRolesOf(db, user.id)]);
        token.firmRoles = firms.map((f) => ({ firmId: f.firmId, role: f.role }));
        token.clientRoles = [...new Set(clients.map((c) => c.role))];
      }
      return token;
    },
    async session({ session, token }) {
      session.user = {
        id: token.userId,
        name: token.name ?? "",
        email: token.email ?? "",
        firmRoles: token.firmRoles ?? [],
        clientRoles: token.clientRoles ?? [],
      };
      session.authAtMs = token.authAtMs;
      session.pwdAtMs = token.pwdAtMs;
      return session;
    },
  },
};
