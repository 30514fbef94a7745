/**
 * Sign in through the app's real next-auth credentials endpoint with plain HTTP (no browser): the CSRF
 * cookie and token first, then the form POST. Returns the cookie header of the new session, or null when
 * the sign-in was refused. Shared by the load benchmarks (scripts/bench-*.ts) and the browser tests.
 */
export async function signInOverHttp(
  baseUrl: string,
  email: string,
  password: string,
  headers: Record<string, string> = {},
): Promise<string | null> {
  const csrf = await fetch(`${baseUrl}/api/auth/csrf`, { headers });
  const csrfCookie = csrf.headers
    .getSetCookie()
    .map((c) => c.split(";")[0])
    .join("; ");
  const { csrfToken } = (await csrf.json()) as { csrfToken: string };
  const res = await fetch(`${baseUrl}/api/auth/callback/credentials`, {
    method: "POST",
    redirect: "manual",
    headers: { ...headers, "content-type": "application/x-www-form-urlencoded", cookie: csrfCookie },
    body: new URLSearchParams({ csrfToken, email, password, json: "true", callbackUrl: `${baseUrl}/projects` }),
  });
  await res.arrayBuffer();
  const session = res.headers
    .getSetCookie()
    .map((c) => c.split(";")[0]!)
    .find((c) => /^(__Secure-)?next-auth\.session-token=./.test(c));
  return session ?? null;
}
