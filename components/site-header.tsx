import Link from "next/link";
import { AccountLinks } from "./auth/account-links";
import { GarageLink } from "./garage/garage-link";
import { StaffLinks } from "./moderation/staff-links";
import { NavLink } from "./nav-link";
import { ThemeSwitch } from "./theme-switch";

// Later sections (contribute, worksheets, moderation) add their links to NAV_ITEMS.
const NAV_ITEMS = [
  { href: "/boards", label: "Boards" },
  { href: "/submit", label: "Contribute" },
];

export function SiteHeader() {
  return (
    <header className="bg-paper">
      {/* a phone gets two rows: the name with the theme switch, then every link in one row that scrolls sideways if it must */}
      <div className="mx-auto grid max-w-page grid-cols-[1fr_auto] items-center gap-x-6 gap-y-1 px-4 pt-3 pb-1 sm:flex sm:flex-wrap sm:pb-2 sm:px-6">
        <Link href="/" className="flex items-center gap-3 text-ink no-underline hover:text-ink sm:mr-auto">
          {/* the name is the link text; the mark is decoration. A plain img: next/image does not optimise an SVG, it would only add lazy loading to the first thing on the page */}
          {/* eslint-disable-next-line @next/next/no-img-element */}
          <img src="/shuntbook-mark.svg" alt="" width={44} height={44} className="size-11" />
          <span className="font-display text-[1.9rem] leading-none font-extrabold tracking-wide uppercase">Shuntbook</span>
        </Link>
        <nav aria-label="Main" className="col-span-2 row-start-2 min-w-0 sm:col-auto sm:row-auto">
          <ul className="relative -mx-1 flex flex-nowrap items-center gap-x-4 overflow-x-auto px-1 whitespace-nowrap sm:gap-x-5">
            {NAV_ITEMS.map((item) => (
              <li key={item.href}>
                <NavLink href={item.href}>{item.label}</NavLink>
              </li>
            ))}
            <GarageLink />
            <StaffLinks />
            <AccountLinks />
          </ul>
        </nav>
        <div className="col-start-2 row-start-1 sm:col-auto sm:row-auto">
          <ThemeSwitch />
        </div>
      </div>
      <div className="sb-scale" aria-hidden="true" />
    </header>
  );
}
