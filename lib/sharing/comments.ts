import { z } from "zod";
import type { Kysely } from "kysely";
import type { Database } from "@/db/schema";
import { authorizeProject, isUuid, type Viewer } from "@/lib/auth/access";
import { ROLE_LABELS, type ProjectRole } from "@/lib/auth/roles";
import { writeAudit } from "@/db/queries/audit";
import { insertComment, listVersionComments } from "@/db/queries/comments";
import { listFirmMembersWithRole } from "@/db/queries/sharing";
import { findVersionHeader } from "@/db/queries/versions";
import { enqueueMail } from "@/lib/mail/outbox";
import { commentMail } from "@/lib/mail/templates";
import { failure, fieldErrorsOf, refused, success, type Outcome } from "./outcome";

export const COMMENT_MAIL_KIND = "comment";

export const commentInputSchema = z.object({
  body: z.string().trim().min(1, "Write a comment first.").max(4000, "Use at most 4000 characters."),
});

export interface CommentDTO {
  id: string;
  body: string;
  createdAt: Date;
  authorId: string | null;
  authorName: string | null;
  /** The author's client role on the project when the list is read; null for the firm (or a removed viewer). */
  authorClientRole: ProjectRole | null;
}

export async function versionComments(
  db: Kysely<Database>,
  viewer: Viewer | null,
  projectId: string,
  versionId: string,
): Promise<Outcome<CommentDTO[]>> {
  const auth = await authorizeProject(db, viewer, projectId, "scenario.viewIssued");
  if (!auth.ok) return refused(auth);
  if (!isUuid(versionId) || !(await findVersionHeader(db, projectId, versionId))) return failure(404, "Not found.");
  return success(await listVersionComments(db, projectId, versionId));
}

/**
 * Who hears about a comment: the consultant who issued the version and the firm's other consultants and
 * admins — everyone in the project's firm except the author.
 */
export function commentRecipients(
  members: { userId: string; email: string; role: "admin" | "consultant" }[],
  authorId: string,
): string[] {
  return [...new Set(members.filter((m) => m.userId !== authorId).map((m) => m.email))];
}

/**
 * Owner, finance (and the firm, replying) comment on an issued version. The comment and one e-mail per
 * firm member are written in one transaction (the outbox sends them).
 */
export async function addComment(
  db: Kysely<Database>,
  viewer: Viewer | null,
  projectId: string,
  versionId: string,
  raw: unknown,
  opts: { appUrl: string },
): Promise<Outcome<{ commentId: string; notified: number }>> {
  const auth = await authorizeProject(db, viewer, projectId, "scenario.comment");
  if (!auth.ok) return refused(auth);
  if (!isUuid(versionId)) return failure(404, "Not found.");
  const version = await findVersionHeader(db, projectId, versionId);
  if (!version) return failure(404, "Not found.");
  const parsed = commentInputSchema.safeParse(raw);
  if (!parsed.success) return failure(400, "Check the comment.", fieldErrorsOf(parsed.error.issues));
  const { project, viewer: author, relation } = auth.access;
  const recipients = commentRecipients(await listFirmMembersWithRole(db, project.firmId), author.id);
  const url = `${opts.appUrl.replace(/\/+$/, "")}/projects/${projectId}/scenarios/${version.scenarioId}/versions/${version.versionNumber}#comments`;
  const mail = commentMail({
    projectName: project.name,
    scenarioName: version.name,
    versionNumber: version.versionNumber,
    authorName: author.name,
    authorRole: ROLE_LABELS[relation],
    body: parsed.data.body,
    url,
  });
  const created = await db.transaction().execute(async (trx) => {
    const c = await insertComment(trx, { versionId, projectId, authorId: author.id, body: parsed.data.body });
    for (const to of recipients) await enqueueMail(trx, { kind: COMMENT_MAIL_KIND, refId: c.id, to, ...mail });
    await writeAudit(trx, {
      actorId: author.id,
      firmId: project.firmId,
      projectId,
      action: "comment.create",
      targetType: "version",
      targetId: versionId,
      detail: { versionNumber: version.versionNumber, scenarioName: version.name, commentId: c.id, length: parsed.data.body.length },
    });
    return c;
  });
  return success({ commentId: created.id, notified: recipients.length });
}
