import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { BenchSheet } from "@/components/worksheets/bench-worksheet";
import { RechargeWorksheetView } from "@/components/worksheets/recharge-worksheet";
import { VoltageSheet } from "@/components/worksheets/voltage-worksheet";
import { ApiError } from "@/lib/http/errors";
import { requirePageUser } from "@/lib/auth";
import { getWorksheet } from "@/lib/worksheets";
import { WORKSHEET_LABELS } from "@/lib/worksheets/common-input";

export const dynamic = "force-dynamic";
export const metadata: Metadata = { title: "Worksheet" };

type Props = { params: Promise<{ id: string }> };

// One of the builder's saved worksheets, of any kind; another person's is simply not found.
export default async function WorksheetPage({ params }: Props) {
  const { id } = await params;
  const user = await requirePageUser(`/garage/worksheets/${id}`);
  const sheetId = Number(id);
  if (!Number.isSafeInteger(sheetId) || sheetId <= 0) notFound();
  const sheet = await getWorksheet(user.id, sheetId).catch((e) => {
    if (e instanceof ApiError && e.status === 404) notFound();
    throw e;
  });
  return (
    <div className="space-y-6">
      <p>
        <Link href={`/garage/quads/${sheet.quadId}`}>← {sheet.quadName}</Link>
      </p>
      <h1 className="font-display text-display uppercase">{sheet.kind === "fly_recharge" ? "Fly and recharge" : WORKSHEET_LABELS[sheet.kind].title}</h1>
      {sheet.kind === "voltage" ? (
        <VoltageSheet initial={sheet} />
      ) : sheet.kind === "bench" ? (
        <BenchSheet initial={sheet} />
      ) : (
        <RechargeWorksheetView initial={sheet} />
      )}
    </div>
  );
}
