/** A column head: its label, or its label with a class of its own (a number column set right, the last without padding). */
type Head = string | { label: string; className: string };

/** A table's column heads, each a `<th scope="col">`; every table of the site writes them this way. */
export function ColumnHeads({ heads, className, role }: { heads: readonly Head[]; className?: string; role?: "columnheader" }) {
  return heads.map((head) => {
    const { label, className: own } = typeof head === "string" ? { label: head, className } : head;
    return (
      <th key={label} scope="col" role={role} className={own}>
        {label}
      </th>
    );
  });
}
