import type { Metadata } from "next";
import { RevertForm, UserForm } from "@/components/admin/admin-forms";
import { EventSummary } from "@/components/moderation/event-words";
import { Pagination } from "@/components/pagination";
import { When } from "@/components/when";
import { requirePageRole } from "@/lib/auth";
import { listAuditEvents, submissionState } from "@/lib/moderation/audit";
import { listUsers } from "@/lib/moderation/users";
import { ROLE_LABELS, STATUS_LABELS, TRUST_LABELS } from "@/lib/vocabulary";

export const dynamic = "force-dynamic";
export const metadata: Metadata = { title: "Admin" };

type Props = { searchParams: Promise<Record<string, string | string[] | undefined>> };
const box = "space-y-3 rounded-md border-3 border-rule bg-surface p-4";

/** The page's own params, leniently: a bad page is page 1, a search is trimmed and cut to the API's 100 characters. */
function parseParams(sp: Record<string, string | string[] | undefined>) {
  const one = (k: string) => (typeof sp[k] === "string" ? (sp[k] as string) : "");
  const page = Number(one("page"));
  return { page: Number.isSafeInteger(page) && page >= 1 && page <= 10_000 ? page : 1, q: one("q").trim().slice(0, 100) };
}

function adminHref(q: string, page: number): string {
  const p = new URLSearchParams();
  if (q) p.set("q", q);
  if (page > 1) p.set("page", String(page));
  const qs = p.toString();
  return qs ? `/admin?${qs}` : "/admin";
}

// /admin: people's roles and trust (searched by name or e-mail, paged), and the moderation log with
// a revert, asked for twice, for each decision that can be undone now. Everything goes through
// lib/moderation, which writes the audit trail.
export default async function AdminPage({ searchParams }: Props) {
  const { page, q } = parseParams(await searchParams);
  const admin = await requirePageRole(adminHref(q, page), "admin");
  const [users, events] = await Promise.all([listUsers({ page, q }), listAuditEvents({ pageSize: 30 }, admin)]);
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
        {/* a plain GET form: the search works without JavaScript and stays in the URL */}
        <form method="get" action="/admin" role="search" aria-label="Find people" className="flex flex-wrap items-end gap-2">
          <label className="flex flex-col text-small font-semibold">
            Name or e-mail
            <input type="search" name="q" defaultValue={q} maxLength={100} className="sb-field min-h-11" />
          </label>
          <button type="submit" className="sb-button min-h-11">
            Find
          </button>
          {q && (
            <a href="/admin" className="inline-flex min-h-11 items-center">
              Show everyone
            </a>
          )}
        </form>
        <p className="text-small text-muted" role="status">
          {users.total === 0
            ? `Nobody matches “${q}”.`
            : `${users.total} ${users.total === 1 ? "person" : "people"}${q ? ` matching “${q}”` : ""} · page ${users.page} of ${users.pageCount}`}
        </p>
        <ul className="space-y-3">
          {users.users.map((u) => (
            <li key={u.id} className={box}>
              <p className="break-words">
                <strong>{u.name}</strong> <span className="text-small text-muted">{u.email}</span>
              </p>
              <p className="text-small">
                {ROLE_LABELS[u.role]} since <When at={u.createdAt} /> · {u.record.approved} approved · {u.record.rejected} rejected · {u.record.pending} pending
                · {TRUST_LABELS[u.trust.reason]}
              </p>
              <UserForm user={{ id: u.id, name: u.name, role: u.role, override: u.trust.override }} />
            </li>
          ))}
        </ul>
        <Pagination page={users.page} pageCount={users.pageCount} hrefFor={(p) => adminHref(q, p)} />
      </section>
      <section aria-labelledby="log" className="space-y-3">
        <h2 id="log" className="font-display text-heading uppercase">
          Latest decisions
        </h2>
        <ol className="space-y-3">
          {events.events.map((e) => {
            const before = e.entity.type === "submission" ? submissionState(e.before) : null;
            return (
              <li key={e.id} className={box}>
                <EventSummary e={e} linkSubmission />
                {e.revertable && e.entity.type === "submission" && before && (
                  <RevertForm eventId={e.id} submissionId={e.entity.id} restores={STATUS_LABELS[before.status]} />
                )}
              </li>
            );
          })}
        </ol>
      </section>
    </div>
  );
}
