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
      <div className="mx-auto flex max-w-page flex-wrap items-center gap-x-6 gap-y-2 px-4 pt-3 pb-2 sm:px-6">
        <Link href="/" className="mr-auto flex items-center gap-3 text-ink no-underline hover:text-ink">
          {/* the name is the link text; the mark is decoration. A plain img: next/image does not optimise an SVG, it would only add lazy loading to the first thing on the page */}
          {/* eslint-disable-next-line @next/next/no-img-element */}
          <img src="/shuntbook-mark.svg" alt="" width={44} height={44} className="size-11" />
          <span className="font-display text-[1.9rem] leading-none font-extrabold tracking-wide uppercase">Shuntbook</span>
        </Link>
        <nav aria-label="Main" className="flex items-center gap-5">
          <ul className="flex flex-wrap items-center gap-x-5 gap-y-1">
            {NAV_ITEMS.map((item) => (
              <li key={item.href}>
                <NavLink href={item.href}>{item.label}</NavLink>
              </li>
            ))}
            <GarageLink />
            <StaffLinks />
            <AccountLinks />
          </ul>
          <ThemeSwitch />
        </nav>
      </div>
      <div className="sb-scale" aria-hidden="true" />
    </header>
  );
}
