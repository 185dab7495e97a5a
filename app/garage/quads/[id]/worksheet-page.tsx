import Link from "next/link";
import { notFound } from "next/navigation";
import type { ReactNode } from "react";
import { ApiError } from "@/lib/http/errors";
import { requirePageUser } from "@/lib/auth";
import { getWorksheet, openWorksheetId, type AnyWorksheetView } from "@/lib/worksheets";
import { quadWorksheetContext } from "@/lib/worksheets/page-context";

type Context = Awaited<ReturnType<typeof quadWorksheetContext>> & { open: AnyWorksheetView | null };

/**
 * What the voltage, bench and hardware worksheet pages share: sign-in, the owner's quad (404 for a bad id or
 * someone else's), and the page frame. `render` gets the quad's family, the published starting
 * values and the quad's open (unpublished, newest) worksheet of this kind, where a builder picks up
 * again at the field; without a family the page says what to set first.
 */
export async function QuadWorksheetPage(props: {
  id: string;
  section: "voltage" | "bench" | "hardware";
  title: string;
  setting: string;
  render: (ctx: Context & { family: NonNullable<Context["family"]> }) => ReactNode;
}) {
  const user = await requirePageUser(`/garage/quads/${props.id}/${props.section}`);
  const quadId = Number(props.id);
  if (!Number.isSafeInteger(quadId) || quadId <= 0) notFound();
  const ctx = await quadWorksheetContext(user.id, quadId).catch((e) => {
    if (e instanceof ApiError && e.status === 404) notFound();
    throw e;
  });
  const { quad, family } = ctx;
  // the hardware worksheet is worked out live and not stored
  const openId = props.section === "hardware" ? null : await openWorksheetId(user.id, quad.id, props.section);
  const open = openId == null ? null : await getWorksheet(user.id, openId);
  return (
    <div className="space-y-6">
      <p>
        <Link href={`/garage/quads/${quad.id}`}>← {quad.name}</Link>
      </p>
      <h1 className="font-display text-display uppercase">{props.title}</h1>
      {family ? (
        props.render({ ...ctx, family, open })
      ) : (
        <p>Give this quad its firmware family first: the worksheet follows that family&rsquo;s {props.setting} rules.</p>
      )}
    </div>
  );
}
