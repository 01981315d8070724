import { useChassisSwaps } from '../api/get-cars';

export type FittedForm = { slugs: string[]; otherChanges: string };

/**
 * The car as it is: which approved swaps are already fitted, and what else was changed. Plans and
 * checks for this car start from here instead of from a stock car.
 */
export function FittedSwapsFields({
  chassisSlug,
  form,
  onChange,
  errors,
}: {
  chassisSlug: string | null;
  form: FittedForm;
  onChange: (next: FittedForm) => void;
  errors: Record<string, string>;
}) {
  const swaps = useChassisSwaps(chassisSlug);
  const toggle = (slug: string, on: boolean) =>
    onChange({ ...form, slugs: on ? [...form.slugs, slug] : form.slugs.filter((s) => s !== slug) });
  const listErrors = Object.entries(errors).filter(([k]) => k.startsWith('fittedSwapSlugs'));
  return (
    <fieldset className="grid gap-2 sm:col-span-2 lg:col-span-3">
      <legend className="text-sm font-bold text-graphite">Swaps already fitted</legend>
      <p className="text-xs text-graphite-soft">Plans for this car start from the car as it is: stock plus what you tick here.</p>
      {!chassisSlug ? (
        <p className="text-sm text-graphite-soft">Pick the chassis first.</p>
      ) : swaps.isPending ? (
        <p className="text-sm text-graphite-soft">Loading the swaps for this chassis…</p>
      ) : (swaps.data ?? []).length === 0 ? (
        <p className="text-sm text-graphite-soft">No approved swaps for this chassis yet.</p>
      ) : (
        <ul className="grid gap-1 sm:grid-cols-2">
          {swaps.data!.map((s) => (
            <li key={s.slug}>
              <label className="flex min-h-10 items-start gap-2 text-sm">
                <input
                  type="checkbox"
                  className="mt-1 h-4 w-4 accent-ink"
                  checked={form.slugs.includes(s.slug)}
                  onChange={(e) => toggle(s.slug, e.target.checked)}
                />
                <span>
                  <span className="font-bold">{s.axle === 'front' ? 'Front' : 'Rear'}:</span> {s.title}
                </span>
              </label>
            </li>
          ))}
        </ul>
      )}
      {listErrors.map(([k, v]) => (
        <p key={k} role="alert" className="text-sm font-semibold text-oxide">
          {v}
        </p>
      ))}
      <label className="grid gap-1 text-sm">
        <span className="font-bold text-graphite">Other changes</span>
        <textarea
          className="min-h-16 rounded-md border border-ink/30 bg-paper-card px-3 py-2"
          maxLength={1000}
          value={form.otherChanges}
          onChange={(e) => onChange({ ...form, otherChanges: e.target.value })}
          placeholder="Braided hoses, uprated pads, lowered 30 mm…"
        />
        {errors.otherChanges && <span className="font-semibold text-oxide">{errors.otherChanges}</span>}
      </label>
    </fieldset>
  );
}
