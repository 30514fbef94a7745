import { ButtonLink } from "@/components/ui/button";
import { ActionButton } from "@/components/forms/action-form";
import { archiveScenarioAction, cloneScenarioAction } from "./actions";

/** Edit, clone, export and issue, for those allowed. Plain forms: they work before hydration and by keyboard. */
export function ScenarioToolbar({
  projectId,
  scenarioId,
  canEdit,
  canIssue,
  archived,
}: {
  projectId: string;
  scenarioId: string;
  canEdit: boolean;
  canIssue: boolean;
  archived: boolean;
}) {
  const base = `/projects/${projectId}/scenarios/${scenarioId}`;
  return (
    <div className="flex flex-wrap gap-2">
      {canEdit && !archived ? <ButtonLink href={`${base}/edit`}>Edit inputs</ButtonLink> : null}
      {canEdit ? (
        <ActionButton
          action={cloneScenarioAction.bind(null, projectId, scenarioId)}
          className="inline-flex items-center justify-center gap-2 rounded-md border border-line-strong bg-paper-raised px-3.5 py-2 text-sm font-medium text-ink hover:bg-paper-sunk"
        >
          Clone
        </ActionButton>
      ) : null}
      <a
        href={`/api/scenarios/${scenarioId}/export`}
        className="inline-flex items-center justify-center gap-2 rounded-md border border-line-strong bg-paper-raised px-3.5 py-2 text-sm font-medium text-ink hover:bg-paper-sunk"
        download
      >
        Export JSON
      </a>
      <ButtonLink href={`${base}/versions`} variant="secondary">
        {canIssue ? "Issue / versions" : "Issued versions"}
      </ButtonLink>
      {canEdit ? (
        <ActionButton
          action={archiveScenarioAction.bind(null, projectId, scenarioId, !archived)}
          className="inline-flex items-center justify-center gap-2 rounded-md px-3.5 py-2 text-sm font-medium text-ink-soft hover:bg-paper-sunk"
          title={archived ? "Show it in the project's list again" : "Hide it from the project's list; issued versions stay visible to clients"}
        >
          {archived ? "Restore" : "Archive"}
        </ActionButton>
      ) : null}
    </div>
  );
}
