import CataloguePage from '../../features/admin/components/catalogue-page';
import { RequireSignedIn } from '../../features/account/components/require-signed-in';

export default function AdminCatalogueRoute() {
  return (
    <RequireSignedIn permission="manage_catalogue" what="the catalogue desk">
      <CataloguePage />
    </RequireSignedIn>
  );
}
