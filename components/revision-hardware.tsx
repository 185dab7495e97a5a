import type { ReactNode } from "react";
import { formatFigure, formatOhms, plural } from "@/lib/catalogue/format";
import { When } from "@/components/when";
import type { BoardRevisionDetail } from "@/lib/catalogue/board-facts";

const Unknown = () => <span className="sb-unknown">unknown</span>;

function Row({ term, children }: { term: string; children: ReactNode }) {
  return (
    <div className="grid grid-cols-[minmax(8rem,40%)_1fr] gap-3 border-b border-rule-soft py-2 last:border-b-0">
      <dt className="text-muted">{term}</dt>
      <dd className="font-mono">{children}</dd>
    </div>
  );
}

function Group({ title, children }: { title: string; children: ReactNode }) {
  return (
    <div>
      <h4 className="border-b-3 border-rule pb-1 font-display text-lg font-bold tracking-wide uppercase">{title}</h4>
      <dl>{children}</dl>
    </div>
  );
}

/** One revision's sensor hardware, every missing figure written as "unknown". */
export function RevisionHardware({ revision: r }: { revision: BoardRevisionDetail }) {
  const headingId = `rev-${r.id}`;
  return (
    <article aria-labelledby={headingId} className="rounded-md border-3 border-rule bg-surface">
      <header className="flex flex-wrap items-baseline justify-between gap-x-4 gap-y-1 border-b-3 border-rule px-4 py-3">
        <h3 id={headingId} className="font-display text-heading uppercase">
          Revision <span className="font-mono normal-case">{r.label}</span>
        </h3>
        <p className="text-small">
          <span className="text-muted">Released </span>
          {r.releasedOn ? <When at={r.releasedOn} /> : <Unknown />}
          <span className="mx-2 text-muted" aria-hidden="true">
            ·
          </span>
          <strong className={r.approvedCount > 0 ? "text-verdigris" : "text-muted"}>{plural(r.approvedCount, "approved value")}</strong>
        </p>
      </header>

      <div className="grid gap-6 px-4 py-4 md:grid-cols-3">
        <Group title="Voltage divider">
          <Row term="Top resistor">{r.dividerTopOhms != null ? formatOhms(r.dividerTopOhms) : <Unknown />}</Row>
          <Row term="Bottom resistor">{r.dividerBottomOhms != null ? formatOhms(r.dividerBottomOhms) : <Unknown />}</Row>
          <Row term="Divider ratio">
            {r.dividerRatio != null ? (
              <>
                <strong>÷{formatFigure(r.dividerRatio, 2)}</strong>
                <span className="block font-body text-small text-muted">pack volts per ADC-pin volt</span>
              </>
            ) : (
              <Unknown />
            )}
          </Row>
        </Group>

        <Group title="Current sensor">
          <Row term="Type">
            {r.currentSensor === "shunt" ? (
              <span className="font-body">Shunt + amplifier</span>
            ) : r.currentSensor === "hall" ? (
              <span className="font-body">Hall sensor</span>
            ) : (
              <Unknown />
            )}
          </Row>
          {r.currentSensor !== "hall" && (
            <>
              <Row term="Shunt">{r.shuntMilliohms != null ? `${formatFigure(r.shuntMilliohms)} mΩ` : <Unknown />}</Row>
              <Row term="Amplifier gain">{r.amplifierGain != null ? `× ${formatFigure(r.amplifierGain)}` : <Unknown />}</Row>
            </>
          )}
          <Row term="Sensitivity">
            {r.sensitivityMvPerAmp != null ? (
              <>
                <strong>{formatFigure(r.sensitivityMvPerAmp)} mV/A</strong>
                {r.currentSensor === "shunt" && (
                  <span className="block font-body text-small text-muted">
                    {formatFigure(r.shuntMilliohms!)} mΩ × {formatFigure(r.amplifierGain!)}
                  </span>
                )}
                {r.currentSensor === "hall" && <span className="block font-body text-small text-muted">from the sensor&rsquo;s rating</span>}
              </>
            ) : (
              <Unknown />
            )}
          </Row>
        </Group>

        <Group title="ADC">
          <Row term="Resolution">{r.adcBits != null ? `${r.adcBits}-bit` : <Unknown />}</Row>
          <Row term="Reference">{r.adcReferenceVolts != null ? `${formatFigure(r.adcReferenceVolts)} V` : <Unknown />}</Row>
        </Group>
      </div>

      {r.notes && (
        <div className="border-t border-rule-soft px-4 py-3">
          <h4 className="font-display text-lg font-bold tracking-wide uppercase">Notes</h4>
          <p className="mt-1 whitespace-pre-line">{r.notes}</p>
        </div>
      )}
    </article>
  );
}
