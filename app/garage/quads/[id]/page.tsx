import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { StartWorksheet } from "@/components/worksheets/start-worksheet";
import { ApiError } from "@/lib/http/errors";
import { requirePageUser } from "@/lib/auth";
import { listQuadWorksheets } from "@/lib/worksheets";
import { quadWorksheetContext } from "@/lib/worksheets/page-context";
import { WORKSHEET_LABELS } from "@/lib/worksheets/common-input";
import { TitledSection } from "@/components/titled-section";
import { When } from "@/components/when";

export const dynamic = "force-dynamic";
export const metadata: Metadata = { title: "Quad" };

type Props = { params: Promise<{ id: string }> };

// One quad of the signed-in builder, with its worksheets. Another person's quad is simply not found.
export default async function QuadPage({ params }: Props) {
  const { id } = await params;
  const user = await requirePageUser(`/garage/quads/${id}`);
  const quadId = Number(id);
  if (!Number.isSafeInteger(quadId) || quadId <= 0) notFound();
  const { quad, published } = await quadWorksheetContext(user.id, quadId).catch((e) => {
    if (e instanceof ApiError && e.status === 404) notFound();
    throw e;
  });
  const sheets = await listQuadWorksheets(user.id, quad.id);
  return (
    <div className="space-y-6">
      <p>
        <Link href="/garage">← My garage</Link>
      </p>
      <h1 className="font-display text-display uppercase">{quad.name}</h1>
      <TitledSection id="sheets" title="Worksheets" className="space-y-3">
        {sheets.length === 0 ? (
          <p className="text-muted">No worksheets yet.</p>
        ) : (
          <ul className="space-y-2">
            {sheets.map((s) => (
              <li key={s.id}>
                <Link href={`/garage/worksheets/${s.id}`} className="font-semibold">
                  {WORKSHEET_LABELS[s.kind].title}, <When at={s.createdAt} />
                </Link>{" "}
                <span className="text-small text-muted">
                  {s.entries} {WORKSHEET_LABELS[s.kind].entries}
                  {s.submissionId ? ", published" : ""}
                </span>
              </li>
            ))}
          </ul>
        )}
        <StartWorksheet quadId={quad.id} publishedScale={published.currentScale} />
        <p>
          <Link href={`/garage/quads/${quad.id}/voltage`} className="font-semibold">
            Check the voltage scale with a multimeter →
          </Link>
        </p>
        <p>
          <Link href={`/garage/quads/${quad.id}/hardware`} className="font-semibold">
            What the board&rsquo;s parts say the scales should be →
          </Link>
        </p>
        <p>
          <Link href={`/garage/quads/${quad.id}/bench`} className="font-semibold">
            Bench current check with a clamp meter (props on; most people should not need it) →
          </Link>
        </p>
      </TitledSection>
    </div>
  );
}
