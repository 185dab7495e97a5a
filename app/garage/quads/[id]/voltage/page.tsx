import type { Metadata } from "next";
import { VoltageWorksheetForm } from "@/components/worksheets/voltage-worksheet";
import { QuadWorksheetPage } from "../worksheet-page";

export const dynamic = "force-dynamic";
export const metadata: Metadata = { title: "Voltage worksheet" };

type Props = { params: Promise<{ id: string }> };

// The voltage worksheet for one of the builder's quads: its family's rules and, as the starting
// value, the board's published recommended voltage scale.
export default async function VoltagePage({ params }: Props) {
  return (
    <QuadWorksheetPage
      id={(await params).id}
      section="voltage"
      title="Voltage check"
      setting="voltage-scale"
      render={({ family, published }) => <VoltageWorksheetForm family={family} startingScale={published.voltageScale} />}
    />
  );
}
