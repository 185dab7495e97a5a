import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { RechargeWorksheetView } from "@/components/worksheets/recharge-worksheet";
import { ApiError } from "@/lib/api/errors";
import { requirePageUser } from "@/lib/auth";
import { getRechargeWorksheet } from "@/lib/worksheets/recharge";

export const dynamic = "force-dynamic";
export const metadata: Metadata = { title: "Fly-and-recharge worksheet" };

type Props = { params: Promise<{ id: string }> };

export default async function WorksheetPage({ params }: Props) {
  const { id } = await params;
  const user = await requirePageUser(`/garage/worksheets/${id}`);
  const sheetId = Number(id);
  if (!Number.isSafeInteger(sheetId) || sheetId <= 0) notFound();
  const sheet = await getRechargeWorksheet(user.id, sheetId).catch((e) => {
    if (e instanceof ApiError && e.status === 404) notFound();
    throw e;
  });
  return (
    <div className="mx-auto max-w-page space-y-6 px-4 py-6 sm:px-6">
      <p><Link href={`/garage/quads/${sheet.quadId}`}>← {sheet.quadName}</Link></p>
      <h1 className="font-display text-display uppercase">Fly and recharge</h1>
      <RechargeWorksheetView initial={sheet} />
    </div>
  );
}
