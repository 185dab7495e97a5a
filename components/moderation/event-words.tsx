import Link from "next/link";
import { When } from "@/components/when";
import type { AuditEventView } from "@/lib/moderation/audit";

// One logged action in plain words for the moderation and admin pages: what was done, by whom
// (or automatically), when, and, for a revert, which earlier action it undid and when; for an
// action undone later, who undid it and when. Never an event number.

const ACTION_VERBS: Record<AuditEventView["action"], string> = {
  approve: "approval",
  auto_approve: "automatic approval",
  reject: "rejection",
  request_changes: "request for changes",
  revert: "revert",
  user_update: "change",
};

export function EventSummary({ e, linkSubmission = false }: { e: AuditEventView; linkSubmission?: boolean }) {
  const who = e.actor?.name ?? "automatically";
  return (
    <>
      <p>
        {e.entity.type === "submission" ? (
          <>
            <strong>{e.action === "auto_approve" ? "Approved automatically" : e.actionLabel}</strong>{" "}
            {linkSubmission && <Link href={`/moderation/${e.entity.id}`}>submission #{e.entity.id}</Link>}
          </>
        ) : (
          <strong>Changed the role or trust of {e.entity.name}</strong>
        )}
        <span className="text-small text-muted">
          {" "}
          · {e.action === "auto_approve" ? "trusted contributor" : `by ${who}`} · <When at={e.at} time />
        </span>
      </p>
      {e.reverts && (
        <p className="text-small">
          Undid the {ACTION_VERBS[e.reverts.action]} of <When at={e.reverts.at} time />.
        </p>
      )}
      {e.reason && <p className="text-small">“{e.reason}”</p>}
      {e.revertedBy && (
        <p className="text-small text-muted">
          Reverted by {e.revertedBy.actor?.name ?? "an admin"} on <When at={e.revertedBy.at} time />.
        </p>
      )}
    </>
  );
}

/** The submission's own log on the review page, newest first. */
export function ReviewLog({ events }: { events: AuditEventView[] }) {
  if (events.length === 0) return null;
  return (
    <section className="space-y-3 rounded-md border-3 border-rule bg-surface p-4" aria-labelledby="log">
      <h2 id="log" className="font-display text-heading uppercase">
        What happened so far
      </h2>
      <ol className="space-y-2">
        {events.map((e) => (
          <li key={e.id}>
            <EventSummary e={e} />
          </li>
        ))}
      </ol>
    </section>
  );
}
