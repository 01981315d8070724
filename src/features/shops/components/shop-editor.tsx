import { useState } from 'react';
import {
  updateShopSchema,
  weekdays,
  weekdayLabels,
  type OpeningPeriod,
  type ShopView,
  type Weekday,
} from '@shared/schemas/shops';
import { fieldErrors } from '@shared/schemas/errors';
import { Button } from '../../../components/ui/button';
import { TextArea, TextInput } from '../../../components/ui/field';
import { ApiError } from '../../../lib/api-client';
import { useUpdateShop } from '../api/get-shop';

/** The shop's own accounts edit its page: about, contact details and the week's opening periods. */
export function ShopEditor({ shop, onDone }: { shop: ShopView; onDone: () => void }) {
  const update = useUpdateShop(shop.slug);
  const [form, setForm] = useState({ name: shop.name, town: shop.town, website: shop.website, about: shop.about });
  const [contact, setContact] = useState(shop.contact);
  const [hours, setHours] = useState<OpeningPeriod[]>(shop.openingHours);
  const [errors, setErrors] = useState<Record<string, string>>({});
  const set = (k: keyof typeof form) => (e: React.ChangeEvent<HTMLInputElement | HTMLTextAreaElement>) =>
    setForm((f) => ({ ...f, [k]: e.target.value }));
  const setC = (k: keyof typeof contact) => (e: React.ChangeEvent<HTMLInputElement | HTMLTextAreaElement>) =>
    setContact((c) => ({ ...c, [k]: e.target.value }));
  const setPeriod = (i: number, change: Partial<OpeningPeriod>) =>
    setHours((h) => h.map((p, j) => (j === i ? { ...p, ...change } : p)));
  const submit = async (e: React.FormEvent) => {
    e.preventDefault();
    const parsed = updateShopSchema.safeParse({ ...form, contact, openingHours: hours });
    if (!parsed.success) return setErrors(fieldErrors(parsed.error.issues));
    try {
      await update.mutateAsync(parsed.data);
      onDone();
    } catch (err) {
      if (err instanceof ApiError) setErrors({ ...err.fields, _: err.message });
    }
  };
  return (
    <form
      onSubmit={submit}
      noValidate
      aria-label="Edit shop page"
      className="grid gap-4 rounded-xl border border-ink/20 bg-paper-card p-5 md:grid-cols-2"
    >
      <TextInput label="Shop name" value={form.name} onChange={set('name')} error={errors.name} />
      <TextInput label="Town" value={form.town} onChange={set('town')} error={errors.town} />
      <TextInput
        label="Website"
        value={form.website}
        onChange={set('website')}
        error={errors.website}
        placeholder="https://…"
        className="md:col-span-2"
      />
      <TextArea
        label="About"
        rows={5}
        value={form.about}
        onChange={set('about')}
        error={errors.about}
        hint="Markdown: **bold**, lists, links. HTML is removed."
        className="md:col-span-2"
      />
      <TextInput label="Phone" value={contact.phone} onChange={setC('phone')} error={errors['contact.phone']} inputMode="tel" />
      <TextInput
        label="E-mail"
        value={contact.email}
        onChange={setC('email')}
        error={errors['contact.email']}
        inputMode="email"
      />
      <TextArea
        label="Address"
        rows={2}
        value={contact.address}
        onChange={setC('address')}
        error={errors['contact.address']}
        className="md:col-span-2"
      />
      <fieldset className="grid gap-2 md:col-span-2">
        <legend className="mb-1 text-sm font-bold text-graphite">Opening hours</legend>
        <p className="text-xs text-graphite-soft">
          One line per opening period; a day without one shows as closed. Two lines for a day with a lunch break.
        </p>
        {hours.map((p, i) => (
          <div key={i} className="flex flex-wrap items-end gap-2" data-testid="opening-period">
            <label className="grid text-xs font-bold text-graphite">
              Day
              <select
                className="rounded-md border border-ink/30 bg-paper px-2 py-1.5 text-sm font-normal"
                value={p.day}
                onChange={(e) => setPeriod(i, { day: e.target.value as Weekday })}
              >
                {weekdays.map((d) => (
                  <option key={d} value={d}>
                    {weekdayLabels[d]}
                  </option>
                ))}
              </select>
            </label>
            <label className="grid text-xs font-bold text-graphite">
              Opens
              <input
                type="time"
                className="rounded-md border border-ink/30 bg-paper px-2 py-1 text-sm font-normal"
                value={p.opens}
                onChange={(e) => setPeriod(i, { opens: e.target.value })}
              />
            </label>
            <label className="grid text-xs font-bold text-graphite">
              Closes
              <input
                type="time"
                className="rounded-md border border-ink/30 bg-paper px-2 py-1 text-sm font-normal"
                value={p.closes}
                onChange={(e) => setPeriod(i, { closes: e.target.value })}
              />
            </label>
            <Button
              variant="quiet"
              aria-label={`Remove ${weekdayLabels[p.day]} ${p.opens}–${p.closes}`}
              onClick={() => setHours((h) => h.filter((_, j) => j !== i))}
            >
              Remove
            </Button>
            {(errors[`openingHours.${i}.closes`] ?? errors[`openingHours.${i}.opens`]) && (
              <p role="alert" className="basis-full text-sm font-semibold text-oxide">
                {errors[`openingHours.${i}.closes`] ?? errors[`openingHours.${i}.opens`]}
              </p>
            )}
          </div>
        ))}
        <div>
          <Button
            variant="secondary"
            onClick={() => setHours((h) => [...h, { day: nextDay(h), opens: '08:00', closes: '17:00' }])}
          >
            Add an opening period
          </Button>
        </div>
        <TextInput
          label="A line beside the hours"
          value={contact.hoursNote}
          onChange={setC('hoursNote')}
          error={errors['contact.hoursNote']}
          placeholder="Saturdays by appointment"
        />
      </fieldset>
      <div className="flex flex-wrap items-center gap-2 md:col-span-2">
        <Button type="submit" disabled={update.isPending}>
          {update.isPending ? 'Saving…' : 'Save shop page'}
        </Button>
        <Button variant="quiet" onClick={onDone}>
          Cancel
        </Button>
        {errors._ && (
          <p role="alert" className="text-sm font-semibold text-oxide">
            {errors._}
          </p>
        )}
      </div>
    </form>
  );
}

/** the day after the last one listed, so adding a week's periods takes a few clicks */
function nextDay(hours: OpeningPeriod[]): Weekday {
  const last = hours.at(-1);
  return last ? weekdays[(weekdays.indexOf(last.day) + 1) % weekdays.length]! : 'mon';
}
