import { When } from "@/components/when";
import { formatFigure } from "@/lib/catalogue/format";
import type { PackView } from "@/lib/garage/packs";
import { ConfirmDelete } from "./confirm-delete";
import { EditToggle } from "./edit-toggle";
import { ChargeForm, PackForm } from "./garage-forms";

// One pack: its log, what the log says about it, and when to land with it (lib/calibration/pack.ts).
// The charging cautions come with it. Where each figure comes from stays in the code, not on screen.
// Edit and Delete for the pack and for each charge of its log; the form for the next charge last.

const v = (volts: number) => `${formatFigure(volts, 2)} V`;

export function PackCard({ pack, today, archives }: { pack: PackView; today: string; archives: boolean }) {
  const w = pack.landing;
  return (
    <article className="space-y-4 rounded-md border-3 border-rule bg-surface p-4 sm:p-5" data-testid={`pack-${pack.id}`}>
      <header>
        <h3 className="font-display text-lg font-bold uppercase">{pack.label}</h3>
        <p className="text-small text-muted">
          {pack.cells}S {w?.label ?? pack.chemistry}, {pack.ratedMah} mAh rated
          {pack.purchasedOn && (
            <>
              , bought <When at={pack.purchasedOn} />
            </>
          )}
        </p>
      </header>
      <div className="flex flex-wrap gap-2">
        <EditToggle label="Edit pack" testId={`pack-${pack.id}-edit`}>
          <PackForm pack={pack} />
        </EditToggle>
        <ConfirmDelete
          endpoint={`/api/v1/garage/packs/${pack.id}`}
          name={`the pack “${pack.label}”`}
          archives={archives}
          consequence={
            archives
              ? "A published worksheet was started from it, so it is archived instead: hidden from your garage, its charge log and your published values kept."
              : "Its charge log goes with it. This cannot be undone."
          }
          testId={`pack-${pack.id}-delete`}
        />
      </div>
      {w && (
        <dl className="grid grid-cols-2 gap-px overflow-hidden rounded-md border-2 border-rule bg-rule sm:grid-cols-4">
          <div className="bg-surface px-3 py-2">
            <dt className="text-small text-muted">Cycles</dt>
            <dd className="font-mono text-lg" data-testid="cycles">
              {w.capacity.cycleCount}
            </dd>
          </div>
          <div className="bg-surface px-3 py-2">
            <dt className="text-small text-muted">Usable capacity</dt>
            <dd className="font-mono text-lg">
              {w.capacity.estimatedUsableMah == null ? (
                <span className="sb-unknown text-body">needs 3 full-flight charges</span>
              ) : (
                `${formatFigure(w.capacity.estimatedUsableMah, 0)} mAh`
              )}
            </dd>
          </div>
          <div className="bg-surface px-3 py-2">
            <dt className="text-small text-muted">Used-capacity alert</dt>
            <dd className="font-mono text-lg">{w.usedCapacityAlert.mah} mAh</dd>
            <dd className="text-small text-muted">
              {w.usedCapacityAlert.fraction * 100} % of the {w.capacity.basis}
            </dd>
          </div>
          <div className="bg-surface px-3 py-2">
            <dt className="text-small text-muted">Land soon / land now</dt>
            <dd className="font-mono text-lg">
              {v(w.landSoon.pack)} / {v(w.landNow.pack)}
            </dd>
            <dd className="text-small text-muted">
              {v(w.landSoon.perCell)} / {v(w.landNow.perCell)} a cell under load
            </dd>
          </div>
        </dl>
      )}
      {w && (
        <p className="text-small">
          Full: <span className="font-mono">{v(w.full.pack)}</span> ({v(w.full.perCell)} a cell).
        </p>
      )}
      {pack.notes.length > 0 && (
        <ul className="space-y-1 rounded-md border-2 border-caution-edge bg-caution p-3 text-small">
          {pack.notes.map((n) => (
            <li key={n.message}>⚠ {n.message}</li>
          ))}
        </ul>
      )}
      {pack.charges.length > 0 && (
        <section aria-label={`Charge log of ${pack.label}`}>
          <h4 className="font-semibold">Charge log</h4>
          <ul className="divide-y divide-rule-soft text-small" data-testid={`charges-${pack.id}`}>
            {pack.charges.map((c) => (
              <li key={c.id} className="flex flex-wrap items-center gap-x-4 gap-y-2 py-2" data-testid={`charge-${c.id}`}>
                <span className="min-w-28">
                  <When at={c.chargedOn} />
                </span>
                <span className="font-mono">{formatFigure(c.chargedMah, 0)} mAh</span>
                <span className="font-mono">{c.restingVoltsPerCell == null ? "—" : `${formatFigure(c.restingVoltsPerCell, 2)} V/cell`}</span>
                <span className="text-muted">{c.afterFullFlight ? "after a full flight" : "not after a full flight"}</span>
                <span className="flex w-full flex-wrap gap-2 sm:ml-auto sm:w-auto">
                  <EditToggle label="Edit" testId={`charge-${c.id}-edit`}>
                    <ChargeForm pack={pack} charge={c} today={today} />
                  </EditToggle>
                  <ConfirmDelete
                    endpoint={`/api/v1/garage/packs/${pack.id}/charges/${c.id}`}
                    name="this charge"
                    consequence="It leaves the log, and the cycle count and usable capacity are worked out again without it."
                    testId={`charge-${c.id}-delete`}
                  />
                </span>
              </li>
            ))}
          </ul>
        </section>
      )}
      {w && (
        <details className="rounded-md border-2 border-caution-edge bg-caution p-3 text-small">
          <summary className="font-semibold">Charging cautions</summary>
          <ul className="mt-2 list-disc space-y-1 pl-5">
            {w.cautions.map((c) => (
              <li key={c.text}>{c.text}</li>
            ))}
          </ul>
        </details>
      )}
      <p className="text-small">
        ⚠ Charge on a fire-safe surface and never leave a charging pack unattended; your charger&rsquo;s and the pack maker&rsquo;s instructions come first.
      </p>
      <ChargeForm pack={pack} today={today} />
    </article>
  );
}
