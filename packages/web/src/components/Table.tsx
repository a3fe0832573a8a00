import type { ReactNode } from 'react';

/** The app's data table: `head` is the header cells, on one ruled row in small dim type; `children` the body rows. */
export function Table({
  className,
  head,
  children,
}: {
  className: string;
  head: ReactNode;
  children: ReactNode;
}) {
  return (
    <table className={className}>
      <thead>
        <tr className="border-b border-rule text-left text-xs text-dim">{head}</tr>
      </thead>
      <tbody>{children}</tbody>
    </table>
  );
}
