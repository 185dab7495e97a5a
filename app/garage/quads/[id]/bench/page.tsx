import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { BenchWorksheetForm } from "@/components/worksheets/bench-worksheet";
import { ApiError } from "@/lib/api/errors";
import { requirePageUser } from "@/lib/auth";
import { quadWorksheetContext } from "@/lib/worksheets/quad-rules";

export const dynamic = "force-dynamic";
export const metadata: Metadata = { title: "Bench worksheet" };

type Props = { params: Promise<{ id: string }> };

// The bench (clamp-meter) worksheet for one of the builder's quads, starting from the board's
// published current scale and offset.
export default async function BenchPage({ params }: Props) {
  const { id } = await params;
  const user = await requirePageUser(`/garage/quads/${id}/bench`);
  const quadId = Number(id);
  if (!Number.isSafeInteger(quadId) || quadId <= 0) notFound();
  const { quad, family, published } = await quadWorksheetContext(user.id, quadId).catch((e) => {
    if (e instanceof ApiError && e.status === 404) notFound();
    throw e;
  });
  return (
    <div className="mx-auto max-w-page space-y-6 px-4 py-6 sm:px-6">
      <p><Link href={`/garage/quads/${quad.id}`}>← {quad.name}</Link></p>
      <h1 className="font-display text-display uppercase">Bench current check</h1>
      {family ? <BenchWorksheetForm family={family} startingScale={published.currentScale} startingOffset={published.currentOffset} /> : <p>Give this quad its firmware family first: the worksheet follows that family&rsquo;s current-scale rules.</p>}
    </div>
  );
}
