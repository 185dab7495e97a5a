import type { Metadata } from "next";
import { BenchWorksheet } from "@/components/worksheets/bench-worksheet";
import type { BenchSheetView } from "@/lib/worksheets/bench-input";
import { QuadWorksheetPage } from "../worksheet-page";

export const dynamic = "force-dynamic";
export const metadata: Metadata = { title: "Bench worksheet" };

type Props = { params: Promise<{ id: string }> };

// The bench (clamp-meter) worksheet for one of the builder's quads: the open one, saved on the
// server, or a start form offering the board's published current scale and offset.
export default async function BenchPage({ params }: Props) {
  return (
    <QuadWorksheetPage
      id={(await params).id}
      section="bench"
      title="Bench current check"
      setting="current-scale"
      render={({ quad, published, open }) => (
        <BenchWorksheet
          quadId={quad.id}
          startingScale={published.currentScale}
          startingOffset={published.currentOffset}
          initial={open as BenchSheetView | null}
        />
      )}
    />
  );
}
