import type { ReactNode } from "react";

/** A page section named by its heading (aria-labelledby `${id}-title`): the site's usual h2 unless `titleClassName` says otherwise. */
export function TitledSection({
  id,
  title,
  className,
  titleClassName = "font-display text-heading uppercase",
  children,
}: {
  id: string;
  title: ReactNode;
  className?: string;
  titleClassName?: string;
  children: ReactNode;
}) {
  return (
    <section aria-labelledby={`${id}-title`} className={className}>
      <h2 id={`${id}-title`} className={titleClassName}>
        {title}
      </h2>
      {children}
    </section>
  );
}

/** A boxed panel inside a section, named by its h3 (aria-labelledby `${id}-title`); `live` re-reads it as it changes. */
export function TitledPanel({
  id,
  title,
  as: Element = "section",
  live = false,
  className,
  children,
}: {
  id: string;
  title: ReactNode;
  as?: "section" | "aside";
  live?: boolean;
  className: string;
  children: ReactNode;
}) {
  return (
    <Element aria-labelledby={`${id}-title`} aria-live={live ? "polite" : undefined} className={className}>
      <h3 id={`${id}-title`} className="font-display text-lg font-bold tracking-wide uppercase">
        {title}
      </h3>
      {children}
    </Element>
  );
}
