import { RequireSignedIn } from '../../features/account/components/require-signed-in';
import ShopLinksPage from '../../features/shops/components/shop-links-page';

export default function ShopLinksRoute() {
  return (
    <RequireSignedIn roles={['shop', 'admin']} what="the shop links list">
      <ShopLinksPage />
    </RequireSignedIn>
  );
}
