import type { Metadata } from "next";
import Link from "next/link";
import { SubmissionForm } from "@/components/submission/submission-form";
import { requirePageUser } from "@/lib/auth";
import { chosenBoard, listFamilyOptions } from "@/lib/submissions/form-data";

export const dynamic = "force-dynamic";
export const metadata: Metadata = {
  title: "Contribute values",
  description: "Send the voltage scale, current scale and current offset you measured for a board, with the evidence behind them.",
};

type Props = { searchParams: Promise<{ board?: string | string[] }> };

// /submit: the contribution form, for signed-in people. ?board=<slug> starts on that board (the
// board page links here).
export default async function SubmitPage({ searchParams }: Props) {
  await requirePageUser("/submit");
  const { board } = await searchParams;
  const [families, initialBoard] = await Promise.all([listFamilyOptions(), typeof board === "string" ? chosenBoard(board) : null]);
  return (
    <div className="space-y-8 pb-12">
      <header className="max-w-prose">
        <p className="font-display text-lg font-bold tracking-wider uppercase">Contribute</p>
        <h1 className="font-display text-title uppercase">Send your values</h1>
        <p className="mt-3 text-lead">
          Tell us which board and firmware you calibrated, how you checked, and what you measured. We work out what your measurements imply and show where your
          values fall among everyone else&rsquo;s before you send.
        </p>
        <p className="mt-2">
          Already sent some? See <Link href="/my/submissions">My submissions</Link>.
        </p>
      </header>
      <noscript>
        <p className="rounded-md border-3 border-fault bg-fault-wash p-4">This form needs JavaScript to check your figures as you type.</p>
      </noscript>
      <SubmissionForm families={families} mode={{ kind: "create" }} initialBoard={initialBoard} />
    </div>
  );
}
