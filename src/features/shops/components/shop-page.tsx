import { useState } from 'react';
import { useParams } from 'react-router';
import { updateShopSchema, type ShopView } from '@shared/schemas/shops';
import { fieldErrors } from '@shared/schemas/errors';
import { Page } from '../../../components/ui/page';
import { Loading, ErrorNotice } from '../../../components/ui/query-state';
import { Button, ButtonLink } from '../../../components/ui/button';
import { TextArea, TextInput } from '../../../components/ui/field';
import { Markdown } from '../../../components/markdown';
import { SwapCard } from '../../../components/swap-card';
import { ApiError } from '../../../lib/api-client';
import { paths } from '../../../config/paths';
import { useShopPage, useUpdateShop } from '../api/get-shop';

export default function ShopPage() {
  const { slug = '' } = useParams();
  const query = useShopPage(slug);
  const [editing, setEditing] = useState(false);
  if (query.isPending)
    return (
      <Page>
        <Loading label="Loading the shop…" />
      </Page>
    );
  if (query.isError)
    return (
      <Page title="Shop not found">
        <ErrorNotice error={query.error} />
      </Page>
    );
  const { shop, swaps, canEdit } = query.data;
  const host = hostOf(shop.website);

  return (
    <Page
      title={shop.name}
      heading={shop.name}
      lead={shop.town ? `Workshop in ${shop.town}` : undefined}
      actions={
        canEdit && !editing ? (
          <div className="flex flex-wrap gap-2">
            <ButtonLink to={paths.shopLinks()} variant="secondary">
              Our shop links
            </ButtonLink>
            <Button onClick={() => setEditing(true)}>Edit shop page</Button>
          </div>
        ) : undefined
      }
    >
      {editing ? (
        <ShopEditor shop={shop} onDone={() => setEditing(false)} />
      ) : (
        <div className="grid gap-6 md:grid-cols-[2fr_1fr]">
          <section aria-label="About the shop" className="rounded-xl border border-ink/10 bg-paper-card p-5">
            {shop.about ? (
              <Markdown>{shop.about}</Markdown>
            ) : (
              <p className="text-graphite-soft">The shop has not written about itself yet.</p>
            )}
          </section>
          <aside className="rounded-xl border border-ink/10 bg-paper-card p-5 text-sm">
            <dl className="space-y-3">
              {shop.town && (
                <div>
                  <dt className="text-xs font-bold uppercase tracking-wide text-graphite-soft">Town</dt>
                  <dd className="font-bold text-graphite">{shop.town}</dd>
                </div>
              )}
              {host && (
                <div>
                  <dt className="text-xs font-bold uppercase tracking-wide text-graphite-soft">Website</dt>
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
              <div>
                <dt className="text-xs font-bold uppercase tracking-wide text-graphite-soft">Swaps it points customers to</dt>
                <dd className="tabular font-bold text-graphite">{swaps.length}</dd>
              </div>
            </dl>
          </aside>
        </div>
      )}

      <section aria-labelledby="shop-swaps-h" className="mt-10">
        <h2 id="shop-swaps-h" className="mb-4 text-xl font-extrabold text-ink">
          Swaps {shop.name} links to
        </h2>
        {swaps.length === 0 ? (
          <p className="text-graphite-soft">No shop links yet.</p>
        ) : (
          <ul className="grid gap-4 sm:grid-cols-2 lg:grid-cols-3">
            {swaps.map((s) => (
              <li key={s.slug} className="flex">
                <SwapCard swap={s} />
              </li>
            ))}
          </ul>
        )}
      </section>
    </Page>
  );
}

function hostOf(url: string) {
  try {
    return url ? new URL(url).host : null;
  } catch {
    return null;
  }
}

function ShopEditor({ shop, onDone }: { shop: ShopView; onDone: () => void }) {
  const update = useUpdateShop(shop.slug);
  const [form, setForm] = useState({ name: shop.name, town: shop.town, website: shop.website, about: shop.about });
  const [errors, setErrors] = useState<Record<string, string>>({});
  const set = (k: keyof typeof form) => (e: React.ChangeEvent<HTMLInputElement | HTMLTextAreaElement>) =>
    setForm((f) => ({ ...f, [k]: e.target.value }));
  const submit = async (e: React.FormEvent) => {
    e.preventDefault();
    const parsed = updateShopSchema.safeParse(form);
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
        rows={6}
        value={form.about}
        onChange={set('about')}
        error={errors.about}
        hint="Markdown: **bold**, lists, links. HTML is removed."
        className="md:col-span-2"
      />
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
