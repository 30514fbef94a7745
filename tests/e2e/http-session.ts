import { signInOverHttp } from "@/scripts/support/http-session";
import { BASE_URL } from "./support";

/** Sign in over plain HTTP against the server under test (see scripts/support/http-session.ts). */
export function signInHttp(email: string, password: string, headers: Record<string, string> = {}): Promise<string | null> {
  return signInOverHttp(BASE_URL, email, password, headers);
}
