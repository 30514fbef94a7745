import nodemailer from "nodemailer";
import { env } from "@/lib/env";

export interface SmtpConfig {
  host: string;
  port: number;
  from: string;
}

export interface MailTransport {
  from: string;
  send(m: { to: string; subject: string; text: string; html: string | null; messageId?: string }): Promise<void>;
}

export function smtpConfigFromEnv(): SmtpConfig {
  const e = env();
  return { host: e.SMTP_HOST, port: e.SMTP_PORT, from: e.MAIL_FROM };
}

function isLoopback(host: string): boolean {
  return host === "localhost" || host === "::1" || /^127\./.test(host);
}

/**
 * nodemailer over SMTP. On loopback (the development catcher, the tests' in-process server) there is
 * nothing to encrypt against, so STARTTLS is skipped; elsewhere nodemailer upgrades when the server offers it.
 * Short timeouts: a stalled server must not hold the sender for minutes — the mail queue retries instead.
 */
export function smtpTransport(config: SmtpConfig = smtpConfigFromEnv()): MailTransport {
  const transporter = nodemailer.createTransport({
    host: config.host,
    port: config.port,
    secure: config.port === 465,
    ignoreTLS: isLoopback(config.host),
    connectionTimeout: 10_000,
    greetingTimeout: 10_000,
    socketTimeout: 20_000,
  });
  return {
    from: config.from,
    async send(m) {
      await transporter.sendMail({ from: config.from, to: m.to, subject: m.subject, text: m.text, html: m.html ?? undefined, ...(m.messageId ? { messageId: m.messageId } : {}) });
    },
  };
}
