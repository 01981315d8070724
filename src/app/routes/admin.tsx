import AdminPage from '../../features/admin/components/admin-page';
import { RequireSignedIn } from '../../features/account/components/require-signed-in';

export default function AdminRoute() {
  return (
    <RequireSignedIn permission="manage_users" what="the admin page">
      <AdminPage />
    </RequireSignedIn>
  );
}
