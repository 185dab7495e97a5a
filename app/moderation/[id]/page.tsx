import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { DecisionForm } from "@/components/moderation/decision-form";
import { EvidenceTables } from "@/components/moderation/evidence-tables";
import { StatusBadge } from "@/components/submission/status-badge";
import { requirePageRole } from "@/lib/auth";
import { formatFigure, plural } from "@/lib/catalogue/format";
import { renderMarkdown } from "@/lib/content/markdown";
import { contributorRecord } from "@/lib/moderation/trust";
import { getBoardValues, type QuantityKey, type QuantityValues } from "@/lib/published/board-values";
import { summarise } from "@/lib/stats";
import { loadSubmissionView, type SubmissionView } from "@/lib/submissions";
import { placeValue } from "@/lib/submissions/placement";
import { db, EvidencePhoto, Submission, User } from "@/models";

export const dynamic = "force-dynamic";
export const metadata: Metadata = { title: "Review a submission" };

type Props = { params: Promise<{ id: string }> };

const QUANTITIES: { key: QuantityKey; title: string }[] = [
  { key: "voltageScale", title: "Voltage scale" },
  { key: "currentScale", title: "Current scale" },
  { key: "currentOffset", title: "Current offset" },
];
const ci = (lo: number | null, hi: number | null) =>
  lo === null || hi === null ? "no interval yet (fewer than 6 values)" : `${formatFigure(lo)}–${formatFigure(hi)}`;

// Where the value falls among the approved ones, and what approving it would do to the median
// and its interval: the same summarise() the published figures come from, with this value added.
function Placement({ title, value, q, counted }: { title: string; value: number | null; q: QuantityValues | null; counted: boolean }) {
  if (value === null) return null;
  if (!q)
    return (
      <li>
        <strong>
          {title} <span className="font-mono">{value}</span>:
        </strong>{" "}
        the first approved value for this revision and family.
      </li>
    );
  const points = (q.points ?? []).map((p) => p.value);
  const p = placeValue(value, q, points);
  const after = summarise([...points, value]);
  const sorted = [...points].sort((a, b) => a - b);
  const lo = sorted[0] ?? value;
  const hi = sorted[sorted.length - 1] ?? value;
  const min = Math.min(lo, value),
    max = Math.max(hi, value);
  const pos = (v: number) => (max === min ? 50 : ((v - min) / (max - min)) * 100);
  return (
    <li className="space-y-2" data-testid={`placement-${title}`}>
      <p>
        <strong>
          {title} <span className="font-mono">{value}</span>
        </strong>{" "}
        {p.modifiedZ === null ? (
          p.rule === "too_few" ? (
            "— too few approved values to judge."
          ) : (
            "— every approved value is the same and this one differs."
          )
        ) : (
          <span className={p.outlier ? "font-semibold text-fault" : ""}>
            — modified z {formatFigure(p.modifiedZ, 2)}
            {p.outlier ? ", beyond ±3.5: far from the others" : ", in line with the others"}.
          </span>
        )}
      </p>
      <div
        className="relative h-8 rounded-sm bg-sunken"
        role="img"
        aria-label={`${q.n} approved values from ${formatFigure(lo)} to ${formatFigure(hi)}; this one is ${formatFigure(value)}`}
      >
        {sorted.map((v, i) => (
          <span key={i} className="absolute top-2 size-2 -translate-x-1/2 rounded-full bg-ink opacity-60" style={{ left: `${pos(v)}%` }} />
        ))}
        <span className="absolute top-0 h-8 w-0.5 bg-verdigris" style={{ left: `${pos(q.median)}%` }} title="median" />
        <span className="absolute top-1 -translate-x-1/2 font-bold text-fault" style={{ left: `${pos(value)}%` }} aria-hidden="true">
          ✕
        </span>
      </div>
      <p className="text-small">
        Now: median <span className="font-mono">{formatFigure(q.median)}</span> of {plural(q.n, "value")}, interval {ci(q.ciLow, q.ciHigh)}.{" "}
        {counted ? (
          "This value is already approved and counted in these figures."
        ) : (
          <>
            If approved: median <span className="font-mono">{after.median === null ? "—" : formatFigure(after.median)}</span> of {plural(after.n, "value")},
            interval {ci(after.ciLow, after.ciHigh)}.
          </>
        )}
      </p>
    </li>
  );
}

function Evidence({ s }: { s: SubmissionView }) {
  return (
    <div className="space-y-3 text-small">
      <EvidenceTables s={s} />
      {(s.evidence.summary?.checks ?? []).map((c) => (
        <p key={c.quantity} className={c.mismatch ? "font-semibold text-fault" : ""}>
          {c.quantity.replace("_", " ")}: the evidence implies {formatFigure(c.implied, 1)}
          {c.mismatch ? " — more than the tolerance away from the value sent" : ""}.
        </p>
      ))}
      {!s.voltageCheck && !(s.cycles && s.cycles.length) && !s.bench && <p>No evidence was sent with this submission.</p>}
    </div>
  );
}

const box = "space-y-3 rounded-md border-3 border-rule bg-surface p-4";
const h2 = "font-display text-heading uppercase";

// /moderation/{id}: one submission beside the approved values of its board revision and family,
// its evidence and photos, the contributor's record, and the decision form.
export default async function ReviewPage({ params }: Props) {
  const { id: raw } = await params;
  const id = Number(raw);
  await requirePageRole(`/moderation/${encodeURIComponent(raw)}`, "moderator");
  if (!Number.isSafeInteger(id) || id <= 0) notFound();
  const s = await loadSubmissionView(id);
  if (!s) notFound();
  db();
  const row = await Submission.findByPk(id, { attributes: ["id", "contributorId"] });
  const [values, record, contributor, photos, others] = await Promise.all([
    getBoardValues(s.board.slug, { revision: s.revision.label, family: s.family.slug, points: true }),
    contributorRecord(row!.contributorId),
    User.findByPk(row!.contributorId, { attributes: ["id", "name"] }),
    EvidencePhoto.findAll({ where: { submissionId: id }, attributes: ["id"] }),
    Submission.findAll({
      where: { contributorId: row!.contributorId, boardRevisionId: s.revision.id },
      attributes: ["id", "status", "createdAt"],
      order: [["createdAt", "DESC"]],
    }),
  ]);
  const group = values?.ok ? (values.values.revisions.find((r) => r.id === s.revision.id)?.families.find((f) => f.family === s.family.slug) ?? null) : null;
  const open = s.status === "pending" || s.status === "changes_requested";
  return (
    <div className="space-y-6 pb-12">
      <header className="space-y-1">
        <p className="font-display text-lg font-bold tracking-wider uppercase">
          <Link href="/moderation">Moderation</Link>
        </p>
        <h1 className="font-display text-title uppercase">
          #{s.id} {s.board.name} <span className="text-muted">rev {s.revision.label}</span>
        </h1>
        <p className="text-muted">
          {s.family.name} {s.firmwareVersion} · {s.method.replace("_", " ")} · sent {new Date(s.createdAt).toUTCString()}
        </p>
        <StatusBadge status={s.status} />
      </header>
      <div className="grid gap-6 lg:grid-cols-[2fr_1fr]">
        <div className="space-y-6">
          <section className={box} aria-labelledby="where">
            <h2 id="where" className={h2}>
              Where the values fall
            </h2>
            <ul className="space-y-4">
              {QUANTITIES.map((q) => (
                <Placement key={q.key} title={q.title} value={s[q.key]} q={group?.[q.key] ?? null} counted={s.status === "approved"} />
              ))}
            </ul>
          </section>
          <section className={box} aria-labelledby="evidence">
            <h2 id="evidence" className={h2}>
              Evidence
            </h2>
            <Evidence s={s} />
            {photos.length > 0 && (
              <ul className="flex flex-wrap gap-2">
                {photos.map((p) => (
                  <li key={p.id}>
                    <a href={`/api/v1/photos/${p.id}`}>
                      {/* a plain img: our own API streams the photo with its access check (moderators see pending photos); an optimiser in between would fetch it without the session and cache it publicly */}
                      {/* eslint-disable-next-line @next/next/no-img-element */}
                      <img src={`/api/v1/photos/${p.id}`} alt="Evidence photo" className="h-32 rounded-sm border-2 border-rule object-cover" />
                    </a>
                  </li>
                ))}
              </ul>
            )}
            {s.notes && <div className="text-small" dangerouslySetInnerHTML={{ __html: renderMarkdown(s.notes) }} />}
          </section>
        </div>
        <div className="space-y-6">
          <section className={box} aria-labelledby="who">
            <h2 id="who" className={h2}>
              Contributor
            </h2>
            <p className="font-semibold">{contributor?.name}</p>
            <p className="text-small">
              {record.approved} approved · {record.rejected} rejected · {record.total} in all
            </p>
            <ul className="text-small">
              {others
                .filter((o) => o.id !== id)
                .slice(0, 10)
                .map((o) => (
                  <li key={o.id}>
                    <Link href={`/moderation/${o.id}`}>#{o.id}</Link> {o.status.replace("_", " ")}
                  </li>
                ))}
            </ul>
          </section>
          {/* always mounted: after a decision the page refreshes as decided, and the form keeps its confirmation */}
          <DecisionForm id={s.id} version={s.version} open={open} />
        </div>
      </div>
    </div>
  );
}
