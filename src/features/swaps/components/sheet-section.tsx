import type { ReactNode } from 'react';

export function SheetSection({
  id,
  title,
  children,
  aside,
}: {
  id: string;
  title: string;
  children: ReactNode;
  aside?: ReactNode;
}) {
  return (
    <section id={id} aria-labelledby={`${id}-h`} className="scroll-mt-20">
      <div className="mb-3 flex flex-wrap items-baseline justify-between gap-2 border-b border-ink/15 pb-1 print:mb-1">
        <h2 id={`${id}-h`} className="text-lg font-extrabold text-ink">
          {title}
        </h2>
        {aside}
      </div>
      {children}
    </section>
  );
}

export function SpecTable({
  caption,
  head,
  rows,
  screenOnly = [],
}: {
  caption: string;
  head: ReactNode[];
  rows: ReactNode[][];
  /** columns left off the printed build sheet, which is for the garage */
  screenOnly?: number[];
}) {
  const cls = (j: number) => (screenOnly.includes(j) ? ' print:hidden' : '');
  return (
    <div className="overflow-x-auto">
      <table className="tabular w-full min-w-[32rem] border-collapse text-left text-sm">
        <caption className="sr-only">{caption}</caption>
        <thead>
          <tr className="border-b border-graphite/20 text-xs uppercase tracking-wide text-graphite-soft">
            {head.map((h, i) => (
              <th key={i} scope="col" className={`px-2 py-2 font-bold${cls(i)}`}>
                {h}
              </th>
            ))}
          </tr>
        </thead>
        <tbody>
          {rows.map((r, i) => (
            <tr key={i} className="print-break-avoid border-b border-graphite/10 align-top">
              {r.map((c, j) => (
                <td key={j} className={`px-2 py-2 print:py-0.5${cls(j)}`}>
                  {c}
                </td>
              ))}
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
