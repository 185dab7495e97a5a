import type { Metadata } from "next";
import { RevertForm, UserForm } from "@/components/admin/admin-forms";
import { requirePageRole } from "@/lib/auth";
import { listAuditEvents } from "@/lib/moderation/audit";
import { TRUST_LABELS } from "@/lib/vocabulary";
import { listUsers } from "@/lib/moderation/users";

export const dynamic = "force-dynamic";
export const metadata: Metadata = { title: "Admin" };

type Props = { searchParams: Promise<Record<string, string | string[] | undefined>> };
const dateTime = new Intl.DateTimeFormat("en-GB", { day: "numeric", month: "short", hour: "2-digit", minute: "2-digit", timeZone: "UTC" });
const box = "space-y-3 rounded-md border-3 border-rule bg-surface p-4";

// /admin: people's roles and trust, and the moderation log with a revert for each decision that
// can still be undone. Everything goes through lib/moderation, which writes the audit trail.
export default async function AdminPage({ searchParams }: Props) {
  await requirePageRole("/admin", "admin");
  const sp = await searchParams;
  const page = Number(sp.page) >= 1 ? Math.floor(Number(sp.page)) : 1;
  const [users, events] = await Promise.all([listUsers({ page }), listAuditEvents({ pageSize: 30 })]);
  return (
    <div className="space-y-8 pb-12">
      <header>
        <p className="font-display text-lg font-bold tracking-wider uppercase">Admin</p>
        <h1 className="font-display text-title uppercase">People and decisions</h1>
      </header>
      <section aria-labelledby="people" className="space-y-3">
        <h2 id="people" className="font-display text-heading uppercase">
          People
        </h2>
        <ul className="space-y-3">
          {users.users.map((u) => (
            <li key={u.id} className={box}>
              <p>
                <strong>{u.name}</strong> <span className="text-small text-muted">{u.email}</span>
              </p>
              <p className="text-small">
                {u.record.approved} approved · {u.record.rejected} rejected · {u.record.pending} pending · {TRUST_LABELS[u.trust.reason]}
              </p>
              <UserForm user={{ id: u.id, name: u.name, role: u.role, override: u.trust.override }} />
            </li>
          ))}
        </ul>
        <p className="text-small text-muted">
          Page {users.page} of {users.pageCount} · {users.total} people{" "}
          {users.page < users.pageCount && <a href={`/admin?page=${users.page + 1}`}>Next page</a>}
        </p>
      </section>
      <section aria-labelledby="log" className="space-y-3">
        <h2 id="log" className="font-display text-heading uppercase">
          Latest decisions
        </h2>
        <ol className="space-y-3">
          {events.events.map((e) => (
            <li key={e.id} className={box}>
              <p>
                <strong>{e.actionLabel}</strong>{" "}
                {e.entity.type === "submission" ? <a href={`/moderation/${e.entity.id}`}>submission #{e.entity.id}</a> : e.entity.name}
                <span className="text-small text-muted">
                  {" "}
                  · {e.actor?.name ?? "Shuntbook"} · {dateTime.format(new Date(e.at))} UTC
                </span>
              </p>
              {e.reason && <p className="text-small">“{e.reason}”</p>}
              {e.revertedByEventId !== null && <p className="text-small text-muted">Reverted by event {e.revertedByEventId}.</p>}
              {e.revertable && <RevertForm eventId={e.id} />}
            </li>
          ))}
        </ol>
      </section>
    </div>
  );
}
