import { useQueryClient } from '@tanstack/react-query';
import { Link, Navigate, useLocation, useParams, useSearchParams } from 'react-router';
import { can } from '@shared/roles';
import { SwapSheet } from '../../features/swaps/components/swap-sheet-page';
import { useSwap } from '../../features/swaps/api/get-swap';
import { swapKeys } from '../../features/swaps/api/swap-keys';
import { useMe } from '../../features/account/api/get-me';
import { useCarBalanceStarts, useCarWheelPresets } from '../../features/cars/components/car-checks';
import { FittedReportsSection } from '../../features/fitted-reports/components/fitted-reports-section';
import { FlagSwapForm } from '../../features/swaps/components/flag-swap-form';
import { MakeShopLinkPanel } from '../../features/shops/components/make-shop-link-panel';
import { RetiredLinkBanner, ShopLinkBanner } from '../../features/shops/components/shop-link-banner';
import { usePinnedSheet } from '../../features/shops/api/shop-links';
import { PlanTrayPanel } from '../../features/plans/components/plan-tray-panel';
import { CarAsItIsNote } from '../../features/plans/components/car-as-it-is-note';
import { carsOnChassis, useMyCars } from '../../features/cars/api/get-cars';
import { Page } from '../../components/ui/page';
import { ErrorNotice, Loading } from '../../components/ui/query-state';
import { ApiError } from '../../lib/api-client';
import { paths } from '../../config/paths';
import { KeepOfflineButton } from '../../features/offline/components/keep-offline-button';

const NO_CHASSIS = { slug: '', make: '', model: '', vehicle: null };

/**
 * The swap sheet as the app composes it: the swaps feature's sheet, with the member's cars as wheel-check
 * presets and as brake-balance figures, fitted reports, the shop-link panel for shop accounts, and, when opened through a shop link
 * (`?via=<code>`), the shop's banner and note over the revision it quoted.
 */
export default function SwapSheetRoute() {
  const { slug = '', n } = useParams();
  const [search] = useSearchParams();
  const via = search.get('via');
  const number = n === undefined ? undefined : Number(n);
  const sheet = useSwap(slug, Number.isInteger(number) ? number : undefined);
  const pinned = usePinnedSheet(via);
  const me = useMe();
  const user = me.data?.user ?? null;
  const qc = useQueryClient();
  const location = useLocation();
  const presets = useCarWheelPresets(sheet.data?.chassis.slug ?? '', Boolean(user));
  const carStarts = useCarBalanceStarts(
    { swapSlug: sheet.data?.swap.slug ?? slug, chassis: sheet.data?.chassis ?? NO_CHASSIS },
    Boolean(user),
  );
  const myCars = useMyCars(Boolean(user));

  if (sheet.isPending || (via && pinned.isPending))
    return (
      <Page>
        <Loading label="Loading the swap sheet…" />
      </Page>
    );
  if (sheet.isError)
    return (
      <Page title="Swap not found">
        <ErrorNotice error={sheet.error} />
      </Page>
    );

  const view = sheet.data;
  // an old address (the title has changed since): the server answered with the swap's current one
  if (view.swap.slug !== slug) {
    const to = location.pathname.replace(/^\/swaps\/[^/]+/, paths.swap(view.swap.slug));
    return <Navigate replace to={`${to}${location.search}`} />;
  }
  const pinnedView = pinned.data && pinned.data.sheet.swap.slug === view.swap.slug ? pinned.data : null;
  const banner = pinnedView ? (
    <ShopLinkBanner pinned={pinnedView} />
  ) : via && pinned.error instanceof ApiError && pinned.error.code === 'link_retired' ? (
    <RetiredLinkBanner message={pinned.error.message} />
  ) : null;

  const refreshSheet = () => void qc.invalidateQueries({ queryKey: swapKeys.detail(view.swap.slug) });
  const shopName = user?.shop && can(user.role, 'manage_shop_links') ? user.shop.name : null;

  return (
    <SwapSheet
      view={view}
      banner={banner}
      presets={presets}
      carStarts={carStarts}
      actions={<KeepOfflineButton view={view} number={n === undefined ? null : view.revision.number} />}
      extraSections={
        <>
          <FittedReportsSection
            slug={view.swap.slug}
            revisions={view.history}
            shownNumber={view.revision.number}
            onChanged={refreshSheet}
          />
          <CarAsItIsNote swapSlug={view.swap.slug} cars={carsOnChassis(myCars.data, view.chassis.slug)} />
          <PlanTrayPanel
            swap={{ slug: view.swap.slug, title: view.revision.data.title, axle: view.swap.axle }}
            chassis={{ id: view.chassis.id, name: `${view.chassis.make} ${view.chassis.model}` }}
          />
          <FlagSwapForm slug={view.swap.slug} signedIn={Boolean(user)} />
          {can(user?.role, 'review') && (
            <p className="text-sm">
              <Link to={paths.reviewRevision(view.revision.id)} className="font-bold text-ink underline">
                Moderate revision {view.revision.number}
              </Link>{' '}
              — take down a photo or the write-up.
            </p>
          )}
          {shopName && (
            <MakeShopLinkPanel
              swapSlug={view.swap.slug}
              shownNumber={view.revision.number}
              currentNumber={view.currentNumber}
              shopName={shopName}
            />
          )}
        </>
      }
    />
  );
}
