import { z } from "zod";
import { text } from "@/lib/validation/text";
import type { Executor } from "@/db/schema";
import { inTransaction } from "@/db/transaction";
import { defineAction } from "@/lib/actions/define";
import { authorizeProject, isUuid, type Viewer } from "@/lib/auth/access";
import { ROLE_LABELS, type ProjectRole } from "@/lib/auth/roles";
import { writeAudit } from "@/db/queries/audit";
import { countRecentCommentsBy, insertComment, listVersionComments, lockCommentAuthor } from "@/db/queries/comments";
import { listFirmMembersWithRole } from "@/db/queries/sharing";
import { findVersionHeader } from "@/db/queries/versions";
import { enqueueMail } from "@/lib/mail/outbox";
import { commentMail } from "@/lib/mail/templates";
import { fail, ok, REFUSALS, type Result } from "@/lib/result";

export const COMMENT_MAIL_KIND = "comment";

/**
 * How many comments one person may post per window (on all projects together). A person types far fewer;
 * a script posting hundreds would flood every firm member's inbox with e-mails.
 */
export const COMMENT_RATE_LIMIT = { max: 10, windowS: 60 } as const;

export const commentInputSchema = z.object({
  body: text().trim().min(1, "Write a comment first.").max(4000, "Use at most 4000 characters."),
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
  db: Executor,
  viewer: Viewer | null,
  projectId: string,
  versionId: string,
): Promise<Result<CommentDTO[]>> {
  const auth = await authorizeProject(db, viewer, projectId, "scenario.viewIssued");
  if (!auth.ok) return auth;
  if (!isUuid(versionId) || !(await findVersionHeader(db, projectId, versionId))) return REFUSALS.notFound;
  return ok(await listVersionComments(db, projectId, versionId));
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
 * Owner, finance (and the firm, replying) comment on an issued version. Input: `{ projectId, versionId,
 * body }`. The comment and one e-mail per firm member are written in one transaction (the outbox sends them).
 */
export const addComment = defineAction({
  gate: { project: "scenario.comment" },
  schema: commentInputSchema.extend({ versionId: text().max(64) }),
  invalidMessage: "Check the comment.",
  run: async (db, { access, appUrl }, { versionId, body }): Promise<Result<{ commentId: string; notified: number }, { retryAfterS: number }>> => {
    const { project, viewer: author, relation } = access;
    const version = isUuid(versionId) ? await findVersionHeader(db, project.id, versionId) : undefined;
    if (!version) return REFUSALS.notFound;
    const recipients = commentRecipients(await listFirmMembersWithRole(db, project.firmId), author.id);
    const url = `${appUrl().replace(/\/+$/, "")}/projects/${project.id}/scenarios/${version.scenarioId}/versions/${version.versionNumber}#comments`;
    const mail = commentMail({
      projectName: project.name,
      scenarioName: version.name,
      versionNumber: version.versionNumber,
      authorName: author.name,
      authorRole: ROLE_LABELS[relation],
      body,
      url,
    });
    const created = await inTransaction(db, async (trx) => {
      // One author's comments are counted and written one at a time (a transaction-scoped lock per author).
      await lockCommentAuthor(trx, author.id);
      const recent = await countRecentCommentsBy(trx, author.id, COMMENT_RATE_LIMIT.windowS);
      if (recent >= COMMENT_RATE_LIMIT.max) return null;
      const c = await insertComment(trx, { versionId, projectId: project.id, authorId: author.id, body });
      for (const to of recipients) await enqueueMail(trx, { kind: COMMENT_MAIL_KIND, refId: c.id, to, ...mail });
      await writeAudit(trx, {
        actorId: author.id,
        firmId: project.firmId,
        projectId: project.id,
        action: "comment.create",
        targetType: "version",
        targetId: versionId,
        detail: { versionNumber: version.versionNumber, scenarioName: version.name, commentId: c.id, length: body.length },
      });
      return c;
    });
    if (!created) {
      return fail(
        429,
        `You have posted ${COMMENT_RATE_LIMIT.max} comments in the last minute; wait a minute before posting more. Your text is still in the box.`,
        { body: [`At most ${COMMENT_RATE_LIMIT.max} comments a minute; wait a minute and post it again.`] },
        { retryAfterS: COMMENT_RATE_LIMIT.windowS },
      );
    }
    return ok({ commentId: created.id, notified: recipients.length });
  },
});
