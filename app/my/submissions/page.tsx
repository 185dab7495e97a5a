import type { Metadata } from "next";
import Link from "next/link";
import { StatusBadge } from "@/components/submission/status-badge";
import { requirePageUser } from "@/lib/auth";
import { formatFigure } from "@/lib/catalogue/format";
import { renderMarkdown } from "@/lib/content/markdown";
import { listOwnSubmissions, parseOwnListQuery, type OwnListPage, type SubmissionView } from "@/lib/submissions";
import { ChipCount, FilterChip } from "@/components/filter-chip";
import { ParamErrors } from "@/components/param-errors";
import { Pagination } from "@/components/pagination";
import { When } from "@/components/when";
import { METHOD_LABELS, SENSING_SOURCE_LABELS, STATUSES, STATUS_LABELS, type SubmissionStatus } from "@/lib/vocabulary";

export const dynamic = "force-dynamic";
export const metadata: Metadata = { title: "My submissions" };

type Props = { searchParams: Promise<Record<string, string | string[] | undefined>> };

const first = (v: string | string[] | undefined) => (Array.isArray(v) ? v[0] : v);

function listHref(status: SubmissionStatus | null, page = 1): string {
  const q = new URLSearchParams();
  if (status) q.set("status", status);
  if (page > 1) q.set("page", String(page));
  const s = q.toString();
  return s ? `/my/submissions?${s}` : "/my/submissions";
}

function withoutField(sp: Record<string, string | string[] | undefined>, field: string): string {
  const status = field === "status" ? null : (first(sp.status) ?? null);
  return listHref(status as SubmissionStatus | null, field === "page" ? 1 : Number(first(sp.page)) || 1);
}

function StatusFilter({ list }: { list: OwnListPage }) {
  const choices: (SubmissionStatus | null)[] = [null, ...STATUSES];
  return (
    <nav aria-label="Show by status">
      <ul className="flex flex-wrap gap-2">
        {choices.map((status) => (
          <li key={status ?? "all"}>
            <FilterChip href={listHref(status)} active={list.status === status}>
              {status ? STATUS_LABELS[status] : "All"}
              <ChipCount n={list.counts[status ?? "all"]} what="submissions" />
            </FilterChip>
          </li>
        ))}
      </ul>
    </nav>
  );
}

// Contributors' and moderators' Markdown goes through the one sanitising renderer.
function Markdown({ text, className = "" }: { text: string; className?: string }) {
  return (
    <div
      className={`space-y-2 [&_a]:font-semibold [&_ol]:list-decimal [&_ol]:pl-5 [&_ul]:list-disc [&_ul]:pl-5 ${className}`}
      dangerouslySetInnerHTML={{ __html: renderMarkdown(text) }}
    />
  );
}

function Values({ s }: { s: SubmissionView }) {
  const rows: [string, number | null][] = [
    ["Voltage scale", s.voltageScale],
    ["Current scale", s.currentScale],
    ["Current offset", s.currentOffset],
  ];
  return (
    <dl className="grid grid-cols-3 gap-px overflow-hidden rounded-md border-2 border-rule bg-rule">
      {rows.map(([term, value]) => (
        <div key={term} className="bg-surface px-3 py-2">
          <dt className="text-small text-muted">{term}</dt>
          <dd className="font-mono text-lg">{value === null ? <span className="sb-unknown text-body">not sent</span> : value}</dd>
        </div>
      ))}
    </dl>
  );
}

function SubmissionCard({ s, highlight }: { s: SubmissionView; highlight: boolean }) {
  const checks = s.evidence.summary?.checks ?? [];
  return (
    <li id={`submission-${s.id}`} className={`space-y-3 rounded-md border-3 bg-surface p-4 sm:p-5 ${highlight ? "border-signal" : "border-rule"}`}>
      <div className="flex flex-wrap items-start justify-between gap-2">
        <div>
          <h2 className="font-display text-heading uppercase">
            <Link href={s.links.board} className="text-ink no-underline hover:underline">
              {s.board.name}
            </Link>{" "}
            <span className="text-muted">rev {s.revision.label}</span>
          </h2>
          <p className="text-small text-muted">
            #{s.id} · {s.family.name} {s.firmwareVersion} · {METHOD_LABELS[s.method]} · {SENSING_SOURCE_LABELS[s.sensingSource]}
          </p>
        </div>
        <StatusBadge status={s.status} />
      </div>
      <Values s={s} />
      {checks.length > 0 && (
        <p className={s.evidence.mismatch ? "font-semibold text-fault" : "text-small"}>
          {s.evidence.mismatch ? "⚠ " : ""}
          Evidence check:{" "}
          {checks
            .map((c) => `${c.quantity.replace("_", " ")} implied ${formatFigure(c.implied, 1)}${c.mismatch ? " (more than the tolerance away)" : ""}`)
            .join("; ")}
          .
        </p>
      )}
      {s.moderatorNote && (
        <section aria-label="Moderator's feedback" className="rounded-md border-2 border-caution-edge bg-caution p-3">
          <h3 className="font-display text-lg font-bold tracking-wide uppercase">Moderator&rsquo;s feedback</h3>
          <Markdown text={s.moderatorNote} className="mt-1" />
        </section>
      )}
      {s.notes && (
        <details>
          <summary className="cursor-pointer font-semibold">Your notes</summary>
          <Markdown text={s.notes} className="mt-2" />
        </details>
      )}
      <div className="flex flex-wrap items-center justify-between gap-3 text-small text-muted">
        <span>
          Sent <When at={s.createdAt} time />
          {s.updatedAt !== s.createdAt && (
            <>
              {" "}
              · last changed <When at={s.updatedAt} time />
            </>
          )}
        </span>
        {s.links.edit && (
          <Link href={s.links.edit} className="sb-button sb-button-quiet min-h-11 text-body" aria-label={`Edit submission #${s.id}`}>
            {s.status === "changes_requested" ? "Make the changes" : "Edit"}
          </Link>
        )}
      </div>
    </li>
  );
}

// /my/submissions: everything the signed-in person has sent, newest first, with its status and
// the moderator's feedback; pending and changes-requested ones can be edited.
export default async function MySubmissionsPage({ searchParams }: Props) {
  const user = await requirePageUser("/my/submissions");
  const sp = await searchParams;
  const sent = first(sp.sent);
  const justNow = Number(sent ?? first(sp.updated));
  const parsed = parseOwnListQuery(sp);
  if (!parsed.ok) {
    return (
      <div className="space-y-4 pb-12">
        <h1 className="font-display text-title uppercase">My submissions</h1>
        <ParamErrors
          fieldErrors={parsed.fieldErrors}
          withoutField={(field) => withoutField(sp, field)}
          list="list of your submissions"
          showWhat="your submissions"
          startOver={{ href: "/my/submissions", label: "Show all your submissions" }}
        />
      </div>
    );
  }
  const list = await listOwnSubmissions(user.id, parsed.params);
  const submissions = list.submissions;
  return (
    <div className="space-y-8 pb-12">
      <header className="flex flex-wrap items-end justify-between gap-4">
        <div>
          <p className="font-display text-lg font-bold tracking-wider uppercase">Contribute</p>
          <h1 className="font-display text-title uppercase">My submissions</h1>
        </div>
        <Link href="/submit" className="sb-button">
          Send new values
        </Link>
      </header>
      {Number.isInteger(justNow) && submissions.some((s) => s.id === justNow) && (
        <p role="status" className="rounded-md border-3 border-verdigris bg-surface p-4 font-semibold">
          {sent ? `Submission #${justNow} received: it is pending review. We have sent you an e-mail.` : `Submission #${justNow} saved.`}
        </p>
      )}
      {list.counts.all > 0 && <StatusFilter list={list} />}
      {list.counts.all === 0 ? (
        <p className="max-w-prose rounded-md border-3 border-rule bg-surface p-4">
          You have not sent any values yet. <Link href="/submit">Send the values you measured</Link> and they will show here while a moderator reviews them.
        </p>
      ) : submissions.length === 0 ? (
        <p className="max-w-prose rounded-md border-3 border-rule bg-surface p-4">
          {list.total === 0 ? "None of your submissions has this status." : "This page is past the last one."}{" "}
          <Link href={listHref(null)}>Show all your submissions</Link>
        </p>
      ) : (
        <ol className="space-y-4" aria-label="Your submissions, newest first">
          {submissions.map((s) => (
            <SubmissionCard key={s.id} s={s} highlight={s.id === justNow} />
          ))}
        </ol>
      )}
      <Pagination page={list.page} pageCount={list.pageCount} hrefFor={(page) => listHref(list.status, page)} />
    </div>
  );
}
