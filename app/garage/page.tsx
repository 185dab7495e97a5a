import type { Metadata } from "next";
import Link from "next/link";
import { PackForm, QuadForm, type Choice } from "@/components/garage/garage-forms";
import { PackCard } from "@/components/garage/pack-card";
import { QuadCard } from "@/components/garage/quad-card";
import { TitledSection } from "@/components/titled-section";
import { requirePageUser } from "@/lib/auth";
import { listPacks } from "@/lib/garage/packs";
import { listQuads } from "@/lib/garage/quads";
import { chosenBoard, type ChosenBoard } from "@/lib/submissions/form-data";
import { publishedUse, quadCards } from "@/lib/worksheets/quad-cards";
import { db, FirmwareFamily } from "@/models";

export const dynamic = "force-dynamic";
export const metadata: Metadata = { title: "My garage" };

type Props = { searchParams: Promise<{ board?: string | string[] }> };

// The signed-in builder's garage: their quads and packs, private to them. ?board=<slug> (the board
// page's "Calibrate this board") starts the new-quad form on that board, shown first. Archived
// quads and packs (kept because a published worksheet used them) are listed by name at the end.

async function familyChoices(): Promise<Choice[]> {
  db();
  const fams = await FirmwareFamily.findAll({ attributes: ["id", "name"], order: [["name", "ASC"]] });
  return fams.map((f) => ({ value: String(f.id), label: f.name }));
}

/** Each quad's board as the picker shows it when the quad is edited, by board slug (one lookup per board). */
async function boardsOf(slugs: (string | null)[]): Promise<Map<string, ChosenBoard | null>> {
  const unique = [...new Set(slugs.filter((s): s is string => s != null))];
  return new Map(await Promise.all(unique.map(async (slug) => [slug, await chosenBoard(slug)] as const)));
}

export default async function GaragePage({ searchParams }: Props) {
  const { board: boardParam } = await searchParams;
  const boardSlug = typeof boardParam === "string" ? boardParam : null;
  const user = await requirePageUser(boardSlug ? `/garage?board=${encodeURIComponent(boardSlug)}` : "/garage");
  const [quads, packs, families, used, preselected, archivedQuads, archivedPacks] = await Promise.all([
    listQuads(user.id).then((q) => quadCards(user.id, q)),
    listPacks(user.id),
    familyChoices(),
    publishedUse(user.id),
    boardSlug ? chosenBoard(boardSlug) : null,
    listQuads(user.id, { archived: true }).then((q) => q.filter((x) => x.archivedAt)),
    listPacks(user.id, { archived: true }).then((p) => p.filter((x) => x.archivedAt)),
  ]);
  const boards = await boardsOf(quads.map((q) => q.boardSlug));
  const today = new Date().toISOString().slice(0, 10);
  const newQuad = (
    <div id="add-quad" className="scroll-mt-4">
      <QuadForm families={families} board={preselected} />
    </div>
  );
  return (
    <div className="space-y-8">
      <header>
        <h1 className="font-display text-display uppercase">My garage</h1>
        <p className="mt-2 max-w-prose">
          Your quads and packs. Only you can see them; a worksheet you finish here can be published to Shuntbook as a contribution.
        </p>
      </header>

      <TitledSection id="quads" title="Quads" className="space-y-4">
        {preselected && newQuad}
        {boardSlug && !preselected && <p className="text-fault">No board is listed as &ldquo;{boardSlug}&rdquo;; find it with the picker below.</p>}
        {quads.length === 0 ? (
          <p className="text-muted">No quads yet: add the first below.</p>
        ) : (
          <ul className="grid gap-3 sm:grid-cols-2" data-testid="quad-list">
            {quads.map((q) => (
              <li key={q.id}>
                <QuadCard quad={q} board={q.boardSlug ? (boards.get(q.boardSlug) ?? null) : null} families={families} archives={used.quadIds.has(q.id)} />
              </li>
            ))}
          </ul>
        )}
        {!preselected && newQuad}
      </TitledSection>

      <TitledSection id="packs" title="Packs" className="space-y-4">
        {packs.length === 0 ? (
          <p className="text-muted">No packs yet: add the first below.</p>
        ) : (
          <ul className="space-y-4" data-testid="pack-list">
            {packs.map((p) => (
              <li key={p.id}>
                <PackCard pack={p} today={today} archives={used.packIds.has(p.id)} />
              </li>
            ))}
          </ul>
        )}
        <PackForm />
      </TitledSection>

      {(archivedQuads.length > 0 || archivedPacks.length > 0) && (
        <details className="rounded-md border-2 border-rule p-4" data-testid="archived">
          <summary className="font-semibold">Archived ({archivedQuads.length + archivedPacks.length}): kept because a published worksheet used them</summary>
          <ul className="mt-2 list-disc pl-5">
            {archivedQuads.map((q) => (
              <li key={`q${q.id}`}>
                <Link href={`/garage/quads/${q.id}`}>{q.name}</Link> (quad)
              </li>
            ))}
            {archivedPacks.map((p) => (
              <li key={`p${p.id}`}>{p.label} (pack)</li>
            ))}
          </ul>
        </details>
      )}
    </div>
  );
}
