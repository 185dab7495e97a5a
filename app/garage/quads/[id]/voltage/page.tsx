import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { VoltageWorksheetForm } from "@/components/worksheets/voltage-worksheet";
import { ApiError } from "@/lib/api/errors";
import { requirePageUser } from "@/lib/auth";
import type { WorksheetFamily } from "@/lib/calibration/worksheets";
import { getQuad } from "@/lib/garage/quads";
import { BoardModel, BoardRevision, db, FirmwareFamily } from "@/models";
import { publishedSetting } from "@/lib/worksheets/recharge";

export const dynamic = "force-dynamic";
export const metadata: Metadata = { title: "Voltage worksheet" };

type Props = { params: Promise<{ id: string }> };

// The voltage worksheet for one of the builder's quads: its family's rules and, as the starting
// value, the board's published recommended voltage scale.
export default async function VoltagePage({ params }: Props) {
  const { id } = await params;
  const user = await requirePageUser(`/garage/quads/${id}/voltage`);
  const quadId = Number(id);
  if (!Number.isSafeInteger(quadId) || quadId <= 0) notFound();
  const quad = await getQuad(user.id, quadId).catch((e) => {
    if (e instanceof ApiError && e.status === 404) notFound();
    throw e;
  });
  db();
  const family = quad.firmwareFamilyId ? await FirmwareFamily.findByPk(quad.firmwareFamilyId) : null;
  const revision = quad.boardRevisionId ? ((await BoardRevision.findByPk(quad.boardRevisionId, { include: [{ model: BoardModel, as: "boardModel" }] })) as BoardRevision & { boardModel: BoardModel }) : null;
  const start = family && revision ? await publishedSetting(revision.boardModel.slug, revision.label, family.slug, "voltageScale") : null;
  const rules: WorksheetFamily | null = family
    ? {
        name: family.name,
        voltageScaleUnit: family.voltageScaleUnit, voltageScaleStep: family.voltageScaleStep, voltageScaleResponse: family.voltageScaleResponse,
        voltageScaleMin: family.voltageScaleMin, voltageScaleMax: family.voltageScaleMax,
        currentScaleUnit: family.currentScaleUnit, currentScaleStep: family.currentScaleStep, currentScaleResponse: family.currentScaleResponse,
        currentScaleMin: family.currentScaleMin, currentScaleMax: family.currentScaleMax,
        currentOffsetUnit: family.currentOffsetUnit, currentOffsetStep: family.currentOffsetStep, currentOffsetMin: family.currentOffsetMin, currentOffsetMax: family.currentOffsetMax,
      }
    : null;
  return (
    <div className="mx-auto max-w-page space-y-6 px-4 py-6 sm:px-6">
      <p><Link href={`/garage/quads/${quad.id}`}>← {quad.name}</Link></p>
      <h1 className="font-display text-display uppercase">Voltage check</h1>
      {rules ? <VoltageWorksheetForm family={rules} startingScale={start} /> : <p>Give this quad its firmware family first: the worksheet follows that family&rsquo;s voltage-scale rules.</p>}
    </div>
  );
}
