import type { ShopLinkPrivate, UpdateShopLinkInput } from '@shared/schemas/shops';
import { TextArea, TextInput } from '../../../components/ui/field';

/** What the shop-link form edits, as the inputs hold it (price as typed, expiry as a date). */
export type LinkDraft = {
  publicNote: string;
  note: string;
  customerRef: string;
  price: string;
  currency: string;
  expiresOn: string;
};

export const emptyLinkDraft: LinkDraft = { publicNote: '', note: '', customerRef: '', price: '', currency: 'EUR', expiresOn: '' };

export function linkDraftFrom(link: { publicNote: string; private: ShopLinkPrivate | null }): LinkDraft {
  const p = link.private;
  return {
    publicNote: link.publicNote,
    note: p?.note ?? '',
    customerRef: p?.customerRef ?? '',
    price: p?.quotedPrice ? (p.quotedPrice.amountMinor / 100).toFixed(2) : '',
    currency: p?.quotedPrice?.currency ?? 'EUR',
    expiresOn: p?.expiresAt ? p.expiresAt.slice(0, 10) : '',
  };
}

/** The body the API takes; a price that is not a number is sent as typed, so the server names the field. */
export function linkBody(d: LinkDraft): Required<UpdateShopLinkInput> {
  const amount = d.price.trim() === '' ? null : Math.round(Number(d.price.replace(',', '.')) * 100);
  return {
    publicNote: d.publicNote,
    note: d.note,
    customerRef: d.customerRef,
    quotedPrice:
      amount === null ? null : { amountMinor: Number.isFinite(amount) ? amount : -1, currency: d.currency.trim().toUpperCase() },
    // the link works through the whole expiry day, in the shop's own time
    expiresAt: d.expiresOn ? new Date(`${d.expiresOn}T23:59:59`).toISOString() : null,
  };
}

/**
 * The two parts of a shop link, side by side and labelled for who reads them: the public note goes to
 * every customer who opens the link; the customer reference, price, expiry and private note stay with the shop.
 */
export function ShopLinkFields({
  value,
  onChange,
  errors,
  sideBySide = true,
}: {
  value: LinkDraft;
  onChange: (next: LinkDraft) => void;
  errors: Record<string, string | undefined>;
  /** false in a narrow column: the public part above the private one */
  sideBySide?: boolean;
}) {
  const set = (k: keyof LinkDraft) => (e: React.ChangeEvent<HTMLInputElement | HTMLTextAreaElement>) =>
    onChange({ ...value, [k]: e.target.value });
  return (
    <div className={`grid gap-4 ${sideBySide ? 'md:grid-cols-2' : ''}`}>
      <fieldset className="grid content-start gap-3 rounded-lg border-2 border-brass/70 bg-paper-card p-3">
        <legend className="px-1 text-sm font-extrabold text-ink">Public — customers see this</legend>
        <p className="text-xs text-graphite-soft">
          Shown above the swap sheet to everyone who opens the link or scans its QR code.
        </p>
        <TextArea
          label="Note for customers"
          rows={4}
          value={value.publicNote}
          maxLength={4000}
          onChange={set('publicNote')}
          hint="What the job includes, what to bring. Markdown; HTML is removed."
          error={errors.publicNote}
        />
      </fieldset>
      <fieldset className="grid content-start gap-3 rounded-lg border-2 border-dashed border-ink/40 bg-paper p-3">
        <legend className="px-1 text-sm font-extrabold text-ink">Private — only your shop sees this</legend>
        <p className="text-xs text-graphite-soft">
          Never shown to customers or other members; the link answers as retired after the expiry date.
        </p>
        <TextInput
          label="Customer reference"
          value={value.customerRef}
          maxLength={120}
          onChange={set('customerRef')}
          error={errors.customerRef}
        />
        <div className="grid grid-cols-[1fr_6rem] gap-2">
          <TextInput
            label="Quoted price"
            inputMode="decimal"
            value={value.price}
            onChange={set('price')}
            placeholder="1240.00"
            error={errors['quotedPrice.amountMinor'] ?? errors.quotedPrice}
          />
          <TextInput
            label="Currency"
            value={value.currency}
            maxLength={3}
            onChange={set('currency')}
            error={errors['quotedPrice.currency']}
          />
        </div>
        <TextInput
          label="Link expires after"
          type="date"
          value={value.expiresOn}
          onChange={set('expiresOn')}
          error={errors.expiresAt}
          hint="Leave empty for a link that stays."
        />
        <TextArea label="Private note" rows={3} value={value.note} maxLength={4000} onChange={set('note')} error={errors.note} />
      </fieldset>
    </div>
  );
}
