import { ROLE_LABELS } from "@/lib/auth/roles";
import type { ProjectRole } from "@/lib/auth/roles";

export interface MailContent {
  subject: string;
  text: string;
  html: string;
}

export function escapeHtml(s: string): string {
  return s.replace(/[&<>"']/g, (c) => ({ "&": "&amp;", "<": "&lt;", ">": "&gt;", '"': "&quot;", "'": "&#39;" })[c]!);
}

function formatDateUtc(d: Date): string {
  return `${d.toISOString().slice(0, 16).replace("T", " ")} UTC`;
}

const ROLE_SCOPE: Record<ProjectRole, string> = {
  owner: "the issued comparisons of this project, a what-if that saves nothing, and comments to the consultant",
  finance: "the issued comparisons of this project with their yearly cash flows, the cost report and the cash-flow workbook",
};

function layout(paragraphs: string[], link?: { href: string; label: string }): string {
  const body = paragraphs.map((p) => `<p style="margin:0 0 12px">${p}</p>`).join("");
  const button = link
    ? `<p style="margin:20px 0"><a href="${escapeHtml(link.href)}" style="background:#157277;color:#fff;padding:10px 16px;border-radius:6px;text-decoration:none">${escapeHtml(link.label)}</a></p>` +
      `<p style="margin:0 0 12px;font-size:13px;color:#3d4b57">Or open this address: <a href="${escapeHtml(link.href)}">${escapeHtml(link.href)}</a></p>`
    : "";
  return `<!doctype html><html><body style="font-family:system-ui,sans-serif;color:#17222b;max-width:560px">${body}${button}<p style="margin-top:24px;font-size:12px;color:#6b7a86">LoopLedger — condenser heat rejection, costed over its life.</p></body></html>`;
}

/** The invitation e-mail. The link is the only place the token is ever written. */
export function invitationMail(p: {
  projectName: string;
  firmName: string;
  inviterName: string;
  role: ProjectRole;
  url: string;
  expiresAt: Date;
}): MailContent {
  const subject = `${p.inviterName} shared "${p.projectName}" with you on LoopLedger`;
  const role = ROLE_LABELS[p.role];
  const text = [
    `${p.inviterName} of ${p.firmName} invites you to the LoopLedger project "${p.projectName}" as ${role}.`,
    ``,
    `You will see ${ROLE_SCOPE[p.role]}.`,
    ``,
    `Accept the invitation (the link works once, until ${formatDateUtc(p.expiresAt)}):`,
    p.url,
    ``,
    `If you did not expect this, ignore this message; nothing happens unless the link is opened and accepted.`,
  ].join("\n");
  const html = layout(
    [
      `${escapeHtml(p.inviterName)} of ${escapeHtml(p.firmName)} invites you to the LoopLedger project <strong>${escapeHtml(p.projectName)}</strong> as ${escapeHtml(role)}.`,
      `You will see ${escapeHtml(ROLE_SCOPE[p.role])}.`,
      `The link works once, until ${escapeHtml(formatDateUtc(p.expiresAt))}. If you did not expect this, ignore this message.`,
    ],
    { href: p.url, label: "Accept the invitation" },
  );
  return { subject, text, html };
}

/** A client viewer's comment, sent to the consultants of the project. */
export function commentMail(p: {
  projectName: string;
  scenarioName: string;
  versionNumber: number;
  authorName: string;
  authorRole: string;
  body: string;
  url: string;
}): MailContent {
  const subject = `New comment on ${p.scenarioName} v${p.versionNumber} — ${p.projectName}`;
  const text = [
    `${p.authorName} (${p.authorRole}) commented on issued version ${p.versionNumber} of "${p.scenarioName}" in "${p.projectName}":`,
    ``,
    ...p.body.split("\n").map((l) => `> ${l}`),
    ``,
    `Open the version: ${p.url}`,
  ].join("\n");
  const html = layout(
    [
      `${escapeHtml(p.authorName)} (${escapeHtml(p.authorRole)}) commented on issued version ${p.versionNumber} of <strong>${escapeHtml(p.scenarioName)}</strong> in ${escapeHtml(p.projectName)}:`,
      `<span style="display:block;border-left:3px solid #a9b7c1;padding-left:10px;white-space:pre-wrap">${escapeHtml(p.body)}</span>`,
    ],
    { href: p.url, label: "Open the version" },
  );
  return { subject, text, html };
}
