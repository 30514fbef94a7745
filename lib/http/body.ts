/** Request-body reading with a byte limit (Web Request API only, no framework imports: proxy.ts uses it too). */

/**
 * Read a request body, refusing it as soon as it passes `limitBytes` (a Content-Length above the limit is
 * refused before anything is read; a chunked or mis-declared body is counted in bytes as it streams).
 */
export async function readBodyLimited(
  request: Request,
  limitBytes: number,
): Promise<{ ok: true; bytes: Uint8Array } | { ok: false; reason: "tooLarge" | "empty" }> {
  const declared = Number(request.headers.get("content-length") ?? NaN);
  if (Number.isFinite(declared) && declared > limitBytes) return { ok: false, reason: "tooLarge" };
  if (!request.body) return { ok: false, reason: "empty" };
  const reader = request.body.getReader();
  const chunks: Uint8Array[] = [];
  let total = 0;
  for (;;) {
    const { done, value } = await reader.read();
    if (done) break;
    total += value.byteLength;
    if (total > limitBytes) {
      await reader.cancel().catch(() => undefined);
      return { ok: false, reason: "tooLarge" };
    }
    chunks.push(value);
  }
  const bytes = new Uint8Array(total);
  let at = 0;
  for (const c of chunks) {
    bytes.set(c, at);
    at += c.byteLength;
  }
  return { ok: true, bytes };
}
