import Link from "next/link";
import { BoardSearch } from "@/components/board-search";
import { getHomeCounts } from "@/lib/catalogue/home-counts";
import { BOARD_KINDS, KIND_PLURALS } from "@/lib/vocabulary";
import { catalogueQueryString } from "@/lib/catalogue/search-params";
import { TitledSection } from "@/components/titled-section";

export const dynamic = "force-dynamic";

const nf = new Intl.NumberFormat("en");

export default async function HomePage() {
  const counts = await getHomeCounts();
  const readouts = [
    { label: "Boards", value: counts.boards },
    { label: "Board revisions", value: counts.revisions },
    { label: "Approved values", value: counts.approvedValues },
  ];

  return (
    <div className="space-y-14">
      <section aria-labelledby="home-title" className="grid gap-8 lg:grid-cols-[1.15fr_1fr] lg:items-end">
        <div>
          <h1 id="home-title" className="font-display text-display font-extrabold uppercase">
            Get your OSD voltage and mAh {/* Dark ink on the yellow in both schemes: cream on yellow fails contrast in dark mode. */}
            <span className="bg-signal px-1 text-on-signal">right.</span>
          </h1>
          <p className="mt-5 max-w-prose text-lead">
            Shuntbook is the pilots&rsquo; logbook of voltage scale, current scale and current offset for each FPV board revision, measured with multimeters and
            chargers by the people who fly them.
          </p>
        </div>
        <div className="rounded-md border-3 border-rule bg-surface p-4 sm:p-6">
          <BoardSearch id="home-search" />
        </div>
      </section>

      <TitledSection id="readouts" title="In the catalogue" titleClassName="sr-only">
        <dl className="grid grid-cols-3 divide-x-2 divide-rule-soft border-y-3 border-rule">
          {readouts.map((r) => (
            // dt before dd in the markup (as the spec wants), figure shown on top
            <div key={r.label} className="flex flex-col-reverse justify-end px-2 py-4 text-center sm:px-4">
              <dt className="mt-1 font-display text-base font-semibold tracking-wide text-muted uppercase sm:text-lg">{r.label}</dt>
              <dd className="font-mono text-readout font-bold whitespace-nowrap tabular-nums">{nf.format(r.value)}</dd>
            </div>
          ))}
        </dl>
      </TitledSection>

      <TitledSection id="kinds" title="Browse by kind">
        <ul className="mt-4 grid grid-cols-1 gap-3 sm:grid-cols-2 lg:grid-cols-5">
          {BOARD_KINDS.map((kind) => (
            <li key={kind}>
              <Link
                href={`/boards${catalogueQueryString({ kind })}`}
                className="group flex h-full min-h-16 items-center justify-between gap-3 rounded-md border-2 border-rule bg-surface px-4 py-3 text-ink no-underline hover:border-copper hover:bg-sunken hover:text-ink"
              >
                <span className="font-display text-xl font-bold uppercase">{KIND_PLURALS[kind]}</span>
                <span className="font-mono text-lg font-bold text-copper" aria-label={`${counts.boardsByKind[kind] ?? 0} boards`}>
                  {nf.format(counts.boardsByKind[kind] ?? 0)}
                </span>
              </Link>
            </li>
          ))}
        </ul>
        <p className="mt-4">
          <Link href="/boards" className="font-semibold">
            See every board
          </Link>
        </p>
      </TitledSection>

      <TitledSection
        id="numbers"
        title="The three numbers"
        className="grid gap-6 md:grid-cols-3"
        titleClassName="font-display text-heading uppercase md:col-span-3"
      >
        {[
          {
            term: "Voltage scale",
            text: "Turns what the ADC pin sees behind the board’s resistor divider back into pack volts. Wrong, and the OSD shows a full pack as half empty, or worse, an empty one as fine.",
          },
          {
            term: "Current scale",
            text: "Turns the shunt or Hall sensor’s output into amps. Wrong, and the mAh counter drifts, so the pack runs lower than the OSD says.",
          },
          {
            term: "Current offset",
            text: "What the sensor reads with no current flowing. It pulls the zero back to zero, so a disarmed craft shows 0 A.",
          },
        ].map((item) => (
          <div key={item.term} className="border-t-3 border-rule pt-3">
            <h3 className="font-display text-2xl uppercase">{item.term}</h3>
            <p className="mt-2">{item.text}</p>
          </div>
        ))}
      </TitledSection>
    </div>
  );
}
