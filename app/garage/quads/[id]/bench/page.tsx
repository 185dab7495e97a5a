import type { Metadata } from "next";
import { BenchWorksheetForm } from "@/components/worksheets/bench-worksheet";
import { QuadWorksheetPage } from "../worksheet-page";

export const dynamic = "force-dynamic";
export const metadata: Metadata = { title: "Bench worksheet" };

type Props = { params: Promise<{ id: string }> };

// The bench (clamp-meter) worksheet for one of the builder's quads, starting from the board's
// published current scale and offset.
export default async function BenchPage({ params }: Props) {
  return (
    <QuadWorksheetPage
      id={(await params).id}
      section="bench"
      title="Bench current check"
      setting="current-scale"
      render={({ family, published }) => (
        <BenchWorksheetForm family={family} startingScale={published.currentScale} startingOffset={published.currentOffset} />
      )}
    />
  );
}
