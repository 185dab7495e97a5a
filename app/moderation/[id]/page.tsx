import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { DecisionForm } from "@/components/moderation/decision-form";
import { EvidenceTables } from "@/components/moderation/evidence-tables";
import { ReviewLog } from "@/components/moderation/event-words";
import { StripPlot } from "@/components/moderation/strip-plot";
import { StatusBadge } from "@/components/submission/status-badge";
import { When } from "@/components/when";
import { requirePageRole } from "@/lib/auth";
import { formatFigure, plural } from "@/lib/catalogue/format";
import { renderMarkdown } from "@/lib/content/markdown";
import { approvalNeedsReason } from "@/lib/moderation/actions";
import { nextInQueue } from "@/lib/moderation/queue";
import { getReview, type Review } from "@/lib/moderation/review";
import type { QuantityKey } from "@/lib/published/board-values-types";
import { MIN_VALUES_TO_JUDGE, MODIFIED_Z_CUTOFF, spreadMultiple } from "@/lib/stats";
import { METHOD_LABELS, STATUS_LABELS, TRUST_LABELS } from "@/lib/vocabulary";
import { parseQueueQuery, queueHref } from "../_data/queue";

export const dynamic = "force-dynamic";
export const metadata: Metadata = { title: "Review a submission" };

type Props = { params: Promise<{ id: string }>; searchParams: Promise<Record<string, string | string[] | undefined>> };

const TITLES: Record<QuantityKey, string> = { voltageScale: "Voltage scale", currentScale: "Current scale", currentOffset: "Current offset" };

type QuantityReview = Review["quantities"][number];
type Figures = NonNullable<QuantityReview["now"]>;

const range = (f: Figures) => (f.ciLow === null || f.ciHigh === null ? "no 95 % range yet" : `95 % range ${formatFigure(f.ciLow)}–${formatFigure(f.ciHigh)}`);

/** Where the value falls, in a moderator's plain words: how many times the usual spread it lies from the median. */
function whereWords(q: QuantityReview): { text: string; far: boolean } {
  const p = q.placement;
  if (!q.now || !p) return { text: "the first approved value for this revision and family.", far: false };
  if (p.rule === "too_few") return { text: `too few approved values to judge (fewer than ${MIN_VALUES_TO_JUDGE}).`, far: false };
  if (p.modifiedZ === null)
    return p.outlier
      ? { text: `far from the others: every approved value is ${formatFigure(q.now.median)} and this one differs.`, far: true }
      : { text: "the same as every approved value.", far: false };
  const times = `${spreadMultiple(p.modifiedZ)}× the usual spread from the median`;
  return p.outlier
    ? { text: `far from the others: ${times} (a value more than ${MODIFIED_Z_CUTOFF}× away is flagged).`, far: true }
    : { text: `in line with the others: ${times}.`, far: false };
}

// Where the value falls among the approved ones (a strip of every approved value with this one
// highlighted), and what approving it would do to the median and its range: lib/moderation's
// review, computed the way the published figures are.
function Placement({ q, counted }: { q: QuantityReview; counted: boolean }) {
  if (q.value === null) return null;
  const title = TITLES[q.quantity];
  const words = whereWords(q);
  return (
    <li className="space-y-2" data-testid={`placement-${title}`}>
      <p>
        <strong>
          {title} <span className="font-mono">{formatFigure(q.value, 4)}</span>
        </strong>{" "}
        — <span className={words.far ? "font-semibold text-fault" : ""}>{words.text}</span>
      </p>
      <StripPlot
        title={title}
        points={q.approved.map((a) => ({ value: a.value, unverified: a.method === "unverified" }))}
        median={q.now?.median ?? null}
        highlight={q.value}
      />
      {q.now && (
        <p className="text-small">
          Now: median <span className="font-mono">{formatFigure(q.now.median)}</span> of {plural(q.now.n, "value")}, {range(q.now)}.{" "}
          {counted ? (
            "This value is already approved and counted in these figures."
          ) : q.ifApproved ? (
            <>
              If approved: median <span className="font-mono">{formatFigure(q.ifApproved.median)}</span> of {plural(q.ifApproved.n, "value")},{" "}
              {range(q.ifApproved)}.
            </>
          ) : null}
        </p>
      )}
    </li>
  );
}

function Evidence({ review }: { review: Review }) {
  const s = review.submission;
  return (
    <div className="space-y-3 text-small">
      <EvidenceTables s={s} />
      {(s.evidence.summary?.checks ?? []).map((c) => (
        <p key={c.quantity} className={c.mismatch ? "font-semibold text-fault" : ""}>
          {c.quantity.replace("_", " ")}: the evidence implies {formatFigure(c.implied, 1)}
          {c.mismatch ? " — more than the tolerance away from the value sent" : ""}.
        </p>
      ))}
      {!s.voltageCheck && !(s.cycles && s.cycles.length) && !s.bench && <p>No readings, cycles or bench points were sent with this submission.</p>}
    </div>
  );
}

function Photos({ photos }: { photos: Review["photos"] }) {
  if (photos.length === 0) return <p className="text-small">No photos.</p>;
  return (
    <ul className="flex flex-wrap gap-2">
      {photos.map((p) => (
        <li key={p.id} className="text-small">
          <a href={p.url}>
            {/* a plain img: our own API streams the photo with its access check (moderators see pending photos); an optimiser in between would fetch it without the session and cache it publicly */}
            {/* eslint-disable-next-line @next/next/no-img-element */}
            <img src={p.url} alt="Evidence photo" className={`h-32 rounded-sm border-2 border-rule object-cover ${p.removedAt ? "opacity-50" : ""}`} />
          </a>
          {p.removedAt && (
            <p>
              Removed by the contributor on <When at={p.removedAt} />
            </p>
          )}
        </li>
      ))}
    </ul>
  );
}

const box = "space-y-3 rounded-md border-3 border-rule bg-surface p-4";
const h2 = "font-display text-heading uppercase";

// /moderation/{id}: one submission beside the approved values of its board revision and family,
// its evidence and photos, the contributor's record, its log, and the decision form with the next
// submission of the queue (under the filters the moderator came with) one tap away.
export default async function ReviewPage({ params, searchParams }: Props) {
  const { id: raw } = await params;
  const sp = await searchParams;
  const filters = parseQueueQuery(sp);
  const back = queueHref(filters, { page: 1 });
  const here = `/moderation/${encodeURIComponent(raw)}${back.slice("/moderation".length)}`;
  await requirePageRole(here, "moderator");
  const id = Number(raw);
  if (!Number.isSafeInteger(id) || id <= 0) notFound();
  const [review, next] = await Promise.all([getReview(id), nextInQueue(filters, id)]);
  if (!review) notFound();
  const s = review.submission;
  const open = s.status === "pending" || s.status === "changes_requested";
  const keep = back.slice("/moderation".length);
  return (
    <div className="space-y-6 pb-12">
      <header className="space-y-1">
        <p className="font-display text-lg font-bold tracking-wider uppercase">
          <Link href={back}>Moderation</Link>
        </p>
        <h1 className="font-display text-title break-words uppercase">
          #{s.id} {s.board.name}
        </h1>
        <p className="text-muted">
          revision {s.revision.label} · {s.family.name} {s.firmwareVersion} · sent <When at={s.createdAt} time />
        </p>
        <p className="flex flex-wrap items-center gap-2">
          <StatusBadge status={s.status} />
          {s.method === "unverified" ? (
            <span className="rounded-sm border-2 border-dashed border-caution-edge px-1.5 text-small font-semibold">Unverified: not measured</span>
          ) : (
            <span className="text-small font-semibold">{METHOD_LABELS[s.method]}</span>
          )}
        </p>
      </header>
      <div className="grid gap-6 lg:grid-cols-[2fr_1fr]">
        <div className="min-w-0 space-y-6">
          <section className={box} aria-labelledby="where">
            <h2 id="where" className={h2}>
              Where the values fall
            </h2>
            <p className="text-small text-muted">
              Each dot is an approved value for this revision and family (hollow: unverified); the dashed line is their median; the red diamond is this
              submission.
            </p>
            <ul className="space-y-6">
              {review.quantities.map((q) => (
                <Placement key={q.quantity} q={q} counted={s.status === "approved"} />
              ))}
            </ul>
          </section>
          <section className={box} aria-labelledby="evidence">
            <h2 id="evidence" className={h2}>
              Evidence
            </h2>
            <Evidence review={review} />
            <Photos photos={review.photos} />
            {s.notes && <div className="text-small" dangerouslySetInnerHTML={{ __html: renderMarkdown(s.notes) }} />}
          </section>
        </div>
        <div className="min-w-0 space-y-6">
          {/* always mounted: after a decision the page refreshes as decided, and the form keeps its confirmation */}
          <DecisionForm
            id={s.id}
            version={s.version}
            open={open}
            flagged={approvalNeedsReason(review.flags)}
            next={next ? { href: `/moderation/${next.id}${keep}`, label: `#${next.id} ${next.board.name}` } : null}
            queueHref={back}
          />
          <section className={box} aria-labelledby="who">
            <h2 id="who" className={h2}>
              Contributor
            </h2>
            <p className="font-semibold">{review.contributor.name}</p>
            <p className="text-small">
              {review.contributor.record.approved} approved · {review.contributor.record.rejected} rejected · {review.contributor.record.total} in all ·{" "}
              {TRUST_LABELS[review.contributor.trust.reason]}
            </p>
            {review.contributor.otherForBoard.length > 0 && (
              <>
                <p className="text-small font-semibold">Their other submissions for this board</p>
                <ul className="text-small">
                  {review.contributor.otherForBoard.slice(0, 10).map((o) => (
                    <li key={o.id}>
                      <Link href={`/moderation/${o.id}`}>#{o.id}</Link> revision {o.revision} · {STATUS_LABELS[o.status].toLowerCase()} ·{" "}
                      <When at={o.createdAt} />
                    </li>
                  ))}
                </ul>
              </>
            )}
          </section>
          <ReviewLog events={review.events} />
        </div>
      </div>
    </div>
  );
}
