import { weekdays, weekdayLabels, type OpeningPeriod, type ShopView } from '@shared/schemas/shops';

const hostOf = (url: string) => {
  try {
    return url ? new URL(url).host : null;
  } catch {
    return null;
  }
};

const label = 'text-xs font-bold uppercase tracking-wide text-graphite-soft';

/** The shop's contact details and its week, as a side card; what the shop left empty is not shown. */
export function ShopContactCard({ shop }: { shop: ShopView }) {
  const host = hostOf(shop.website);
  const { phone, email, address, hoursNote } = shop.contact;
  return (
    <aside aria-label="Contact and opening hours" className="rounded-xl border border-ink/10 bg-paper-card p-5 text-sm">
      <dl className="space-y-3">
        {address && (
          <div>
            <dt className={label}>Address</dt>
            <dd className="whitespace-pre-line font-bold text-graphite">{address}</dd>
          </div>
        )}
        {!address && shop.town && (
          <div>
            <dt className={label}>Town</dt>
            <dd className="font-bold text-graphite">{shop.town}</dd>
          </div>
        )}
        {phone && (
          <div>
            <dt className={label}>Phone</dt>
            <dd>
              <a
                href={`tel:${phone.replace(/[^+0-9]/g, '')}`}
                className="tabular font-bold text-ink underline decoration-brass underline-offset-2"
              >
                {phone}
              </a>
            </dd>
          </div>
        )}
        {email && (
          <div>
            <dt className={label}>E-mail</dt>
            <dd>
              <a href={`mailto:${email}`} className="break-all font-bold text-ink underline decoration-brass underline-offset-2">
                {email}
              </a>
            </dd>
          </div>
        )}
        {host && (
          <div>
            <dt className={label}>Website</dt>
            <dd>
              <a
                href={shop.website}
                rel="nofollow noopener noreferrer"
                target="_blank"
                className="font-bold text-ink underline decoration-brass underline-offset-2"
              >
                {host}
              </a>
            </dd>
          </div>
        )}
      </dl>
      <OpeningHours periods={shop.openingHours} note={hoursNote} />
    </aside>
  );
}

function OpeningHours({ periods, note }: { periods: OpeningPeriod[]; note: string }) {
  if (periods.length === 0 && !note) return null;
  return (
    <section aria-labelledby="hours-h" className="mt-5 border-t border-ink/10 pt-4">
      <h2 id="hours-h" className={label}>
        Opening hours
      </h2>
      {periods.length > 0 && (
        <table className="tabular mt-2 w-full">
          <tbody>
            {weekdays.map((day) => {
              const open = periods.filter((p) => p.day === day);
              return (
                <tr key={day} className="border-b border-ink/5 last:border-0">
                  <th scope="row" className="py-1 pr-3 text-left font-semibold text-graphite">
                    {weekdayLabels[day]}
                  </th>
                  <td className={`py-1 text-right ${open.length ? 'font-bold text-graphite' : 'text-graphite-soft'}`}>
                    {open.length ? open.map((p) => `${p.opens}–${p.closes}`).join(', ') : 'Closed'}
                  </td>
                </tr>
              );
            })}
          </tbody>
        </table>
      )}
      {note && <p className="mt-2 text-graphite">{note}</p>}
    </section>
  );
}
