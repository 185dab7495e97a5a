import type { Metadata } from "next";
import Link from "next/link";
import { ChargeForm, PackForm, QuadForm, type Choice } from "@/components/garage/garage-forms";
import { PackCard } from "@/components/garage/pack-card";
import { requirePageUser } from "@/lib/auth";
import { listPacks } from "@/lib/garage/packs";
import { listQuads } from "@/lib/garage/quads";
import { BoardModel, BoardRevision, db, FirmwareFamily } from "@/models";
import { TitledSection } from "@/components/titled-section";

export const dynamic = "force-dynamic";
export const metadata: Metadata = { title: "My garage" };

// The signed-in builder's garage: their quads and packs, private to them.

async function choices(): Promise<{ revisions: Choice[]; families: Choice[]; revisionName: Map<number, string>; familyName: Map<number, string> }> {
  db();
  const revs = await BoardRevision.findAll({
    include: [{ model: BoardModel, as: "boardModel", attributes: ["name"] }],
    order: [
      ["boardModelId", "ASC"],
      ["position", "ASC"],
    ],
  });
  const fams = await FirmwareFamily.findAll({ attributes: ["id", "name"], order: [["name", "ASC"]] });
  const revisions = revs.map((r) => ({
    value: String(r.id),
    label: `${(r as BoardRevision & { boardModel?: BoardModel }).boardModel?.name ?? "Board"} ${r.label}`,
  }));
  const families = fams.map((f) => ({ value: String(f.id), label: f.name }));
  return {
    revisions,
    families,
    revisionName: new Map(revisions.map((r) => [Number(r.value), r.label])),
    familyName: new Map(families.map((f) => [Number(f.value), f.label])),
  };
}

export default async function GaragePage() {
  const user = await requirePageUser("/garage");
  const [quads, packs, lists] = await Promise.all([listQuads(user.id), listPacks(user.id), choices()]);
  const today = new Date().toISOString().slice(0, 10);
  return (
    <div className="space-y-8">
      <header>
        <h1 className="font-display text-display uppercase">My garage</h1>
        <p className="mt-2 max-w-prose">
          Your quads and packs. Only you can see them; a worksheet you finish here can be published to Shuntbook as a contribution.
        </p>
      </header>

      <TitledSection id="quads" title="Quads" className="space-y-4">
        {quads.length === 0 ? (
          <p className="text-muted">No quads yet: add the first below.</p>
        ) : (
          <ul className="grid gap-3 sm:grid-cols-2" data-testid="quad-list">
            {quads.map((q) => (
              <li key={q.id} className="rounded-md border-3 border-rule bg-surface p-4">
                <h3 className="font-display text-lg font-bold uppercase">
                  <Link href={`/garage/quads/${q.id}`} className="text-ink">
                    {q.name}
                  </Link>
                </h3>
                <dl className="mt-2 grid grid-cols-[auto_1fr] gap-x-3 gap-y-1 text-small">
                  <dt className="text-muted">Board</dt>
                  <dd>{q.boardRevisionId ? lists.revisionName.get(q.boardRevisionId) : <span className="sb-unknown">not chosen</span>}</dd>
                  <dt className="text-muted">Firmware</dt>
                  <dd>
                    {[q.firmwareFamilyId ? lists.familyName.get(q.firmwareFamilyId) : null, q.firmwareVersion].filter(Boolean).join(" ") || (
                      <span className="sb-unknown">not given</span>
                    )}
                  </dd>
                  <dt className="text-muted">ESC</dt>
                  <dd>{q.esc ?? <span className="sb-unknown">not given</span>}</dd>
                </dl>
                {q.notes && <p className="mt-2 text-small whitespace-pre-line">{q.notes}</p>}
              </li>
            ))}
          </ul>
        )}
        <QuadForm revisions={lists.revisions} families={lists.families} />
      </TitledSection>

      <TitledSection id="packs" title="Packs" className="space-y-4">
        {packs.length === 0 ? (
          <p className="text-muted">No packs yet: add the first below.</p>
        ) : (
          <ul className="space-y-4" data-testid="pack-list">
            {packs.map((p) => (
              <li key={p.id}>
                <PackCard pack={p}>
                  <ChargeForm packId={p.id} today={today} />
                </PackCard>
              </li>
            ))}
          </ul>
        )}
        <PackForm />
      </TitledSection>
    </div>
  );
}
