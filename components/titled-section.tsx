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
