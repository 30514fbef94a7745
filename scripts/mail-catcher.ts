/**
 * Local mail catcher for development (`npm start` runs it when this file exists): an SMTP server on
 * 127.0.0.1:$SMTP_PORT (2525) that keeps every message, and an inbox on http://127.0.0.1:$MAIL_CATCHER_HTTP_PORT
 * (1080) that lists them and shows each with clickable links. Both listen on loopback only.
 */
import http from "node:http";
import { loadDotEnv } from "./dotenv";
import { startCaptureServer, type CapturedMail } from "../lib/mail/capture";
import { escapeHtml } from "../lib/mail/templates";

loadDotEnv();
const HOST = "127.0.0.1";
const smtpPort = Number(process.env.SMTP_PORT ?? 2525);
const httpPort = Number(process.env.MAIL_CATCHER_HTTP_PORT ?? 1080);

function linkify(text: string): string {
  return escapeHtml(text).replace(/https?:\/\/[^\s<>"']+/g, (url) => `<a href="${url}">${url}</a>`);
}

function page(title: string, body: string): string {
  return `<!doctype html><html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width, initial-scale=1">
<title>${escapeHtml(title)}</title>
<style>
body{font-family:system-ui,sans-serif;margin:0;background:#f6f8f9;color:#17222b}
header{background:#fff;border-bottom:1px solid #d3dce2;padding:12px 20px}
main{max-width:960px;margin:0 auto;padding:20px}
table{width:100%;border-collapse:collapse;background:#fff;border:1px solid #d3dce2}
th,td{text-align:left;padding:8px 10px;border-top:1px solid #d3dce2;font-size:14px;vertical-align:top}
th{font-size:12px;text-transform:uppercase;color:#6b7a86;border-top:0}
a{color:#0f5a5e} pre{white-space:pre-wrap;background:#fff;border:1px solid #d3dce2;padding:14px;font-size:14px}
dl{display:grid;grid-template-columns:max-content 1fr;gap:4px 14px;font-size:14px}
dt{color:#6b7a86} iframe{width:100%;height:520px;border:1px solid #d3dce2;background:#fff}
</style></head><body><header><strong>LoopLedger mail catcher</strong> · development only · nothing here leaves this machine</header><main>${body}</main></body></html>`;
}

function listPage(messages: CapturedMail[]): string {
  if (messages.length === 0) {
    return page("Inbox", `<p>No messages yet. Mail sent to SMTP ${HOST}:${smtpPort} appears here (reload the page).</p>`);
  }
  const rows = messages
    .map(
      (m) =>
        `<tr><td>${escapeHtml(m.receivedAt.toISOString().slice(0, 19).replace("T", " "))}</td><td>${escapeHtml(m.envelopeTo.join(", "))}</td>` +
        `<td><a href="/messages/${m.id}">${escapeHtml(m.subject || "(no subject)")}</a></td></tr>`,
    )
    .join("");
  return page("Inbox", `<h1>Inbox (${messages.length})</h1><table><thead><tr><th>Received (UTC)</th><th>To</th><th>Subject</th></tr></thead><tbody>${rows}</tbody></table>`);
}

function messagePage(m: CapturedMail): string {
  // The HTML part is shown in a sandboxed frame (no scripts); links open in a new tab.
  const html = m.html
    ? `<h2>HTML part</h2><iframe sandbox="allow-popups allow-popups-to-escape-sandbox" srcdoc="${escapeHtml(m.html.replace(/<a /g, '<a target="_blank" '))}"></iframe>`
    : "";
  return page(
    m.subject,
    `<p><a href="/">← Inbox</a></p><h1>${escapeHtml(m.subject || "(no subject)")}</h1>
<dl><dt>From</dt><dd>${escapeHtml(m.from)}</dd><dt>To</dt><dd>${escapeHtml(m.to || m.envelopeTo.join(", "))}</dd>
<dt>Received</dt><dd>${escapeHtml(m.receivedAt.toISOString())}</dd></dl>
<h2>Text part</h2><pre>${linkify(m.text)}</pre>${html}`,
  );
}

async function main() {
  const smtp = await startCaptureServer({
    host: HOST,
    port: smtpPort,
    onMessage: (m) => console.log(`[mail-catcher] caught "${m.subject}" for ${m.envelopeTo.join(", ")} → http://${HOST}:${httpPort}/messages/${m.id}`),
  });
  const server = http.createServer((req, res) => {
    const url = new URL(req.url ?? "/", `http://${HOST}:${httpPort}`);
    const send = (status: number, body: string, type = "text/html; charset=utf-8") => {
      res.writeHead(status, { "content-type": type, "cache-control": "no-store", "x-content-type-options": "nosniff" });
      res.end(body);
    };
    if (req.method !== "GET") return send(405, "method not allowed", "text/plain");
    if (url.pathname === "/") return send(200, listPage(smtp.messages));
    if (url.pathname === "/messages.json") return send(200, JSON.stringify(smtp.messages), "application/json");
    const m = /^\/messages\/(\d+)(\.json)?$/.exec(url.pathname);
    const msg = m ? smtp.messages.find((x) => x.id === Number(m[1])) : undefined;
    if (!msg) return send(404, page("Not found", `<p>No such message. <a href="/">Inbox</a></p>`));
    return m?.[2] ? send(200, JSON.stringify(msg), "application/json") : send(200, messagePage(msg));
  });
  await new Promise<void>((resolve) => server.listen(httpPort, HOST, resolve));
  console.log(`[mail-catcher] SMTP on ${HOST}:${smtpPort}; inbox at http://${HOST}:${httpPort}`);
  const stop = () => {
    server.close();
    void smtp.close().then(() => process.exit(0));
  };
  process.on("SIGINT", stop);
  process.on("SIGTERM", stop);
}

main().catch((err) => {
  console.error(`[mail-catcher] could not start: ${err instanceof Error ? err.message : err}`);
  process.exit(1);
});
