import { SMTPServer } from "smtp-server";
import { simpleParser } from "mailparser";

/**
 * An SMTP server that accepts every message and keeps it parsed in memory: the development mail
 * catcher (scripts/mail-catcher.ts) and the tests' in-process server. Loopback only; no TLS, no auth.
 */
export interface CapturedMail {
  id: number;
  receivedAt: Date;
  envelopeFrom: string;
  envelopeTo: string[];
  from: string;
  to: string;
  subject: string;
  text: string;
  html: string | null;
  messageId: string | null;
}

export interface CaptureServer {
  port: number;
  messages: CapturedMail[];
  /** Resolves with the first message (already received or still to come) that matches. */
  waitFor(match: (m: CapturedMail) => boolean, timeoutMs?: number): Promise<CapturedMail>;
  close(): Promise<void>;
}

function addressText(a: unknown): string {
  if (!a) return "";
  if (Array.isArray(a)) return a.map(addressText).join(", ");
  return typeof (a as { text?: unknown }).text === "string" ? (a as { text: string }).text : "";
}

export async function startCaptureServer(opts: { host?: string; port: number; keep?: number; onMessage?: (m: CapturedMail) => void }): Promise<CaptureServer> {
  const host = opts.host ?? "127.0.0.1";
  const messages: CapturedMail[] = [];
  const waiters: { match: (m: CapturedMail) => boolean; resolve: (m: CapturedMail) => void }[] = [];
  let nextId = 1;
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ["STARTTLS", "AUTH"],
    logger: false,
    banner: "LoopLedger local mail catcher",
    size: 10 * 1024 * 1024,
    onData(stream, session, callback) {
      simpleParser(stream)
        .then((parsed) => {
          const mail: CapturedMail = {
            id: nextId++,
            receivedAt: new Date(),
            envelopeFrom: session.envelope.mailFrom ? session.envelope.mailFrom.address : "",
            envelopeTo: session.envelope.rcptTo.map((r) => r.address),
            from: addressText(parsed.from),
            to: addressText(parsed.to),
            subject: parsed.subject ?? "",
            text: parsed.text ?? "",
            html: typeof parsed.html === "string" ? parsed.html : null,
            messageId: parsed.messageId ?? null,
          };
          messages.unshift(mail);
          if (messages.length > (opts.keep ?? 500)) messages.pop();
          opts.onMessage?.(mail);
          for (const w of [...waiters]) {
            if (w.match(mail)) {
              waiters.splice(waiters.indexOf(w), 1);
              w.resolve(mail);
            }
          }
          callback();
        })
        .catch((err: Error) => callback(err));
    },
  });
  await new Promise<void>((resolve, reject) => {
    server.once("error", reject);
    server.listen(opts.port, host, () => {
      server.off("error", reject);
      resolve();
    });
  });
  server.on("error", (err) => console.error("[mail-catcher] SMTP error:", err.message));
  return {
    port: opts.port,
    messages,
    waitFor(match, timeoutMs = 30_000) {
      const found = messages.find(match);
      if (found) return Promise.resolve(found);
      return new Promise((resolve, reject) => {
        const w = { match, resolve: (m: CapturedMail) => (clearTimeout(t), resolve(m)) };
        const t = setTimeout(() => {
          waiters.splice(waiters.indexOf(w), 1);
          reject(new Error(`no matching message within ${timeoutMs} ms (received ${messages.length})`));
        }, timeoutMs);
        waiters.push(w);
      });
    },
    close: () => new Promise<void>((resolve) => server.close(() => resolve())),
  };
}

/** The first http(s) link in a text body. */
export function firstLink(text: string): string | undefined {
  return /https?:\/\/[^\s<>"]+/.exec(text)?.[0];
}
