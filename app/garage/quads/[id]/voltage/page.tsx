import type { Metadata } from "next";
import { VoltageWorksheet } from "@/components/worksheets/voltage-worksheet";
import type { VoltageSheetView } from "@/lib/worksheets/voltage-input";
import { QuadWorksheetPage } from "../worksheet-page";

export const dynamic = "force-dynamic";
export const metadata: Metadata = { title: "Voltage worksheet" };

type Props = { params: Promise<{ id: string }> };

// The voltage worksheet for one of the builder's quads: the open one, saved on the server, or a
// start form offering the board's published recommended voltage scale.
export default async function VoltagePage({ params }: Props) {
  return (
    <QuadWorksheetPage
      id={(await params).id}
      section="voltage"
      title="Voltage check"
      setting="voltage-scale"
      render={({ quad, published, open }) => (
        <VoltageWorksheet quadId={quad.id} startingScale={published.voltageScale} initial={open as VoltageSheetView | null} />
      )}
    />
  );
}
