import type { ReactNode } from "react";
import { formatFigure } from "@/lib/catalogue/format";
import type { PackView } from "@/lib/garage/packs";

// One pack: its log, what the log says about it, and when to land with it (lib/calibration/pack.ts).
// The charging cautions come with it. Where each figure comes from stays in the code, not on screen.

const v = (volts: number) => `${formatFigure(volts, 2)} V`;

export function PackCard({ pack, children }: { pack: PackView; children?: ReactNode }) {
  const w = pack.landing;
  return (
    <article className="space-y-4 rounded-md border-3 border-rule bg-surface p-4 sm:p-5" data-testid={`pack-${pack.id}`}>
      <header>
        <h3 className="font-display text-lg font-bold uppercase">{pack.label}</h3>
        <p className="text-small text-muted">
          {pack.cells}S {w?.label ?? pack.chemistry}, {pack.ratedMah} mAh rated{pack.purchasedOn ? `, bought ${pack.purchasedOn}` : ""}
        </p>
      </header>
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
        <div className="overflow-x-auto">
          <table className="w-full text-small">
            <caption className="text-left font-semibold">Charge log</caption>
            <thead>
              <tr className="text-left text-muted">
                <th className="py-1 pr-3">Date</th>
                <th className="pr-3">mAh in</th>
                <th className="pr-3">Resting V/cell</th>
                <th>Full flight before</th>
              </tr>
            </thead>
            <tbody>
              {pack.charges.map((c) => (
                <tr key={c.id} className="border-t border-rule">
                  <td className="py-1 pr-3 font-mono">{c.chargedOn}</td>
                  <td className="pr-3 font-mono">{formatFigure(c.chargedMah, 0)}</td>
                  <td className="pr-3 font-mono">{c.restingVoltsPerCell == null ? "—" : formatFigure(c.restingVoltsPerCell, 2)}</td>
                  <td>{c.afterFullFlight ? "yes" : "no"}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
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
      {children}
    </article>
  );
}
