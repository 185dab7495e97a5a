import type { Metadata } from "next";
import { HardwareWorksheetForm } from "@/components/worksheets/hardware-worksheet";
import type { QuadView } from "@/lib/garage/quads";
import { quadHardware } from "@/lib/worksheets/hardware";
import { QuadWorksheetPage } from "../worksheet-page";

export const dynamic = "force-dynamic";
export const metadata: Metadata = { title: "From the hardware" };

type Props = { params: Promise<{ id: string }> };

// From the hardware, for one of the builder's quads: the settings its board's parts imply, from
// the board revision record (or figures the builder reads off the board), beside the published values.
export default async function HardwarePage({ params }: Props) {
  return (
    <QuadWorksheetPage
      id={(await params).id}
      section="hardware"
      title="From the hardware"
      setting="voltage-scale and current-scale"
      render={({ quad, family, published }) => <HardwareFigures quad={quad} family={family} published={published} />}
    />
  );
}

async function HardwareFigures({ quad, family, published }: { quad: QuadView } & Pick<Parameters<typeof HardwareWorksheetForm>[0], "family" | "published">) {
  const { board, figures } = await quadHardware(quad);
  return (
    <HardwareWorksheetForm
      family={family}
      quadId={quad.id}
      board={board}
      fromBoard={figures}
      published={{ voltageScale: published.voltageScale, currentScale: published.currentScale }}
    />
  );
}
