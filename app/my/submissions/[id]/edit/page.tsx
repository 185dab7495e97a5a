import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { StatusBadge } from "@/components/submission/status-badge";
import { draftFromView } from "@/components/submission/draft";
import { SubmissionForm } from "@/components/submission/submission-form";
import { requirePageUser } from "@/lib/auth";
import { chosenBoard, listFamilyOptions } from "@/lib/submissions/form-data";
import { getOwnSubmission } from "@/lib/submissions";

export const dynamic = "force-dynamic";
export const metadata: Metadata = { title: "Edit a submission" };

type Props = { params: Promise<{ id: string }> };

// /my/submissions/{id}/edit: the contribution form on a stored submission, for its contributor,
// while it is pending or changes were requested. Someone else's submission is a 404 here.
export default async function EditSubmissionPage({ params }: Props) {
  const { id } = await params;
  const user = await requirePageUser(`/my/submissions/${encodeURIComponent(id)}/edit`);
  const submission = /^[1-9][0-9]{0,9}$/.test(id) ? await getOwnSubmission(user.id, Number(id)) : null;
  if (!submission) notFound();

  const heading = (
    <header className="max-w-prose">
      <p className="font-display text-lg font-bold tracking-wider uppercase">
        <Link href="/my/submissions" className="no-underline hover:underline">
          My submissions
        </Link>
      </p>
      <h1 className="font-display text-title uppercase">Edit submission #{submission.id}</h1>
      <p className="mt-3 flex flex-wrap items-center gap-3">
        <StatusBadge status={submission.status} />
        <span>
          {submission.board.name}, revision {submission.revision.label} · {submission.family.name}
        </span>
      </p>
    </header>
  );

  if (!submission.editable) {
    return (
      <div className="space-y-6 pb-12">
        {heading}
        <p className="max-w-prose rounded-md border-3 border-rule bg-surface p-4">
          A moderator has decided this submission, so it can no longer be changed. If your values have changed since,{" "}
          <Link href={`/submit?board=${encodeURIComponent(submission.board.slug)}`}>send a new submission</Link>.
        </p>
      </div>
    );
  }

  const [families, board] = await Promise.all([listFamilyOptions(), chosenBoard(submission.board.slug)]);
  return (
    <div className="space-y-8 pb-12">
      {heading}
      {submission.status === "changes_requested" && <p className="max-w-prose">Saving your changes sends the submission back for review.</p>}
      <SubmissionForm
        families={families}
        mode={{ kind: "edit", id: submission.id, version: submission.version }}
        initialDraft={draftFromView(submission)}
        initialBoard={board}
      />
    </div>
  );
}
