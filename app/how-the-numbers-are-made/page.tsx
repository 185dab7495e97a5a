import type { Metadata } from "next";
import Link from "next/link";
import { SafetyNote } from "@/components/safety-note";
import { TitledSection } from "@/components/titled-section";
import { BENCH_MIN_R_SQUARED, CURRENT_ROUNDING_WHY, STOP_TOLERANCE, VOLTAGE_ROUNDING_WHY, VOLTAGE_TOLERANCE } from "@/lib/calibration";
import { CONFIDENCE_EXPLANATIONS, MIN_VALUES_TO_JUDGE, MODIFIED_Z_CUTOFF, minimumCountForCi } from "@/lib/stats";
import { CONFIDENCE_TITLES, type ConfidenceLabel } from "@/lib/vocabulary";

export const metadata: Metadata = { title: "How the numbers are made" };

// The one page that explains, in plain words, how every published figure and every worksheet answer
// is worked out. The figures come from the same constants the code uses, so the page cannot drift
// from the rules. Where each rule comes from (handbooks, textbooks, common practice) is written in
// docs/methods.md and beside the code, not here: the owner keeps source notes off the screen.

const pct = (x: number) => `${Math.round(x * 1000) / 10} %`;

function Formula({ children }: { children: React.ReactNode }) {
  return <p className="my-2 overflow-x-auto rounded-md border-2 border-rule-soft bg-sunken px-3 py-2 font-mono">{children}</p>;
}

const section = "max-w-prose space-y-3";

export default function HowTheNumbersAreMadePage() {
  return (
    <div className="space-y-10 pb-12">
      <header className="max-w-prose space-y-3">
        <p className="font-display text-lg font-bold tracking-wider uppercase">Reference</p>
        <h1 className="font-display text-title uppercase">How the numbers are made</h1>
        <p className="text-lead">
          Every value on a board page comes from values that builders measured on their own boards and a moderator approved. This page says how they are
          combined, how sure we are of them, and how the worksheets work out a setting.
        </p>
      </header>

      <TitledSection id="groups" title="One group per revision and firmware family" className={section}>
        <p>
          Values are only compared with values for the same board revision and the same firmware family. Families store their settings in different units, and
          some count up where others count down, so a number from one family means nothing in another.
        </p>
      </TitledSection>

      <TitledSection id="middle" title="The middle value" className={section}>
        <p>
          The headline of each setting is the median: sort the approved values and take the one in the middle (or halfway between the two middle ones). One
          careless value cannot drag it far, which an average would.
        </p>
      </TitledSection>

      <TitledSection id="range" title="The 95 % range for the middle value" className={section}>
        <p>
          Beside the median stands a range that holds the true middle value with at least 95 % confidence. It is read off the sorted values themselves, so it
          does not assume the values follow a bell curve. It needs at least {minimumCountForCi()} values; with fewer, no range is given.
        </p>
      </TitledSection>

      <TitledSection id="confidence" title="How sure we are" className={section}>
        <p>Each published setting carries one of these words. A label needs every condition it names; otherwise the next one down applies.</p>
        <dl className="space-y-3">
          {(Object.keys(CONFIDENCE_TITLES) as ConfidenceLabel[]).map((label) => (
            <div key={label} className="rounded-md border-2 border-rule bg-surface p-3">
              <dt className="font-display text-lg font-bold uppercase">{CONFIDENCE_TITLES[label]}</dt>
              <dd>{CONFIDENCE_EXPLANATIONS[label]}</dd>
            </div>
          ))}
        </dl>
      </TitledSection>

      <TitledSection id="far" title="Values far from the others" className={section}>
        <p>
          The usual spread of a group is worked out from how far its values typically sit from the median, again in a way a few wild values cannot inflate. A
          value more than {MODIFIED_Z_CUTOFF}× the usual spread from the median is marked as far from the others, and a moderator looks at it twice before it
          counts. A second, independent check marks values well outside the middle half of the group. Groups with fewer than {MIN_VALUES_TO_JUDGE} values are
          not judged at all.
        </p>
        <p>Far from the others is a reason to look closer, not a verdict: boards and their parts vary.</p>
      </TitledSection>

      <TitledSection id="worksheets" title="What the worksheets work out" className={section}>
        <h3 className="font-display text-lg font-bold uppercase">Voltage scale</h3>
        <p>
          Compare the voltage on the display with a multimeter across the pack (at the main lead, or the balance plug&rsquo;s two outer pins). Where a larger
          setting makes the display read higher:
        </p>
        <Formula>new setting = old setting × multimeter volts ÷ displayed volts</Formula>
        <p>
          Where a larger setting makes it read lower, the two volts swap places. With several readings, the median of the settings each reading implies is
          taken. A display within {pct(VOLTAGE_TOLERANCE)} of the multimeter needs no change.
        </p>
        <h3 className="font-display text-lg font-bold uppercase">Current scale by fly and recharge</h3>
        <p>
          Fly a pack, note the mAh the display showed at landing, recharge it and note the mAh the charger put back. The charger is the reference. Where a
          larger setting makes the display count fewer mAh:
        </p>
        <Formula>new setting = old setting × displayed mAh ÷ charged mAh</Formula>
        <p>
          Where a larger setting makes it count more, the two mAh swap places. Repeat until the display is within {pct(STOP_TOLERANCE)} of the charger on two
          flights in a row; it usually settles in three to five. Packs never hold exactly their rated capacity, so single flights scatter.
        </p>
        <h3 className="font-display text-lg font-bold uppercase">Current scale and offset with a clamp meter</h3>
        <p>
          At several steady throttle levels, note the current the display shows and the current a clamp meter reads on the main lead. A straight line through
          those points gives the scale (its slope) and the offset (where it crosses zero current). The line must explain at least {pct(BENCH_MIN_R_SQUARED)} of
          the variation in the readings before it is trusted.
        </p>
        <h3 className="font-display text-lg font-bold uppercase">From the parts list</h3>
        <p>
          With no measured values yet, a board page works the settings out from the parts on record: the voltage divider&rsquo;s two resistors give its ratio,
          and the shunt&rsquo;s resistance times its amplifier&rsquo;s gain (or the Hall sensor&rsquo;s rated output) gives volts per amp. Part tolerances make
          this a starting point only; measure before you fly on it.
        </p>
      </TitledSection>

      <TitledSection id="rounding" title="Rounding to whole steps" className={section}>
        <p>Firmware stores whole steps, so the exact answer is rounded.</p>
        <ul className="list-disc space-y-2 pl-5">
          <li>
            <strong>Voltage scale.</strong> {VOLTAGE_ROUNDING_WHY}
          </li>
          <li>
            <strong>Current scale.</strong> {CURRENT_ROUNDING_WHY}
          </li>
        </ul>
      </TitledSection>

      <SafetyNote />

      <p>
        <Link href="/boards" className="font-semibold">
          Look up your board
        </Link>
      </p>
    </div>
  );
}
