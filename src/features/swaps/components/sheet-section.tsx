import type { ReactNode } from 'react';

export function SheetSection({
  id,
  title,
  children,
  aside,
  printTitle,
}: {
  id: string;
  title: string;
  children: ReactNode;
  aside?: ReactNode;
  /** the heading on paper, where the section prints only part of itself */
  printTitle?: string;
}) {
  return (
    <section id={id} aria-labelledby={`${id}-h`} className="scroll-mt-20">
      <div className="print-keep-with-next mb-3 flex flex-wrap items-baseline justify-between gap-2 border-b border-ink/15 pb-1 print:mb-1">
        <h2 id={`${id}-h`} className="text-lg font-extrabold text-ink">
          {printTitle ? (
            <>
              <span className="print:hidden">{title}</span>
              <span className="hidden print:inline">{printTitle}</span>
            </>
          ) : (
            title
          )}
        </h2>
        {aside}
      </div>
      {children}
    </section>
  );
}

/** What a table cell shows when the record gives nothing; on a phone such a line is left out of the row's card. */
export const emptyCell = <span className="text-graphite-soft">—</span>;

/**
 * A spec table. Wide enough screens and paper get a table; on a phone each row becomes a small card of
 * "label: value" lines, so nothing needs scrolling sideways.
 */
export function SpecTable({
  caption,
  head,
  rows,
  screenOnly = [],
}: {
  caption: string;
  head: string[];
  rows: ReactNode[][];
  /** columns left off the printed build sheet, which is for the garage */
  screenOnly?: number[];
}) {
  const only = (j: number) => (screenOnly.includes(j) ? 'print:hidden' : '');
  return (
    <table
      // a short table stays on one page with its heading
      className={`tabular w-full border-collapse text-left text-sm max-sm:block ${rows.length <= 6 ? 'print-break-avoid' : ''}`}
      data-reflow="phone"
    >
      <caption className="sr-only">{caption}</caption>
      <thead className="max-sm:sr-only">
        <tr className="border-b border-graphite/20 text-xs uppercase tracking-wide text-graphite-soft">
          {head.map((h, i) => (
            <th key={i} scope="col" className={`px-2 py-2 font-bold print:py-1 ${only(i)}`}>
              {h}
            </th>
          ))}
        </tr>
      </thead>
      <tbody className="max-sm:block">
        {rows.map((r, i) => (
          <tr
            key={i}
            className="print-break-avoid border-b border-graphite/10 align-top max-sm:block max-sm:rounded-lg max-sm:border max-sm:bg-paper-card max-sm:p-2 max-sm:[&+tr]:mt-2"
          >
            {r.map((c, j) => (
              <td
                key={j}
                data-label={head[j]}
                className={`px-2 py-2 print:py-0.5 ${c === emptyCell || c === '—' ? 'max-sm:hidden' : 'max-sm:flex'} max-sm:gap-2 max-sm:px-1 max-sm:py-0.5 max-sm:before:w-28 max-sm:before:shrink-0 max-sm:before:text-xs max-sm:before:font-bold max-sm:before:uppercase max-sm:before:tracking-wide max-sm:before:text-graphite-soft max-sm:before:content-[attr(data-label)] ${only(j)}`}
              >
                <div className="min-w-0">{c}</div>
              </td>
            ))}
          </tr>
        ))}
      </tbody>
    </table>
  );
}
