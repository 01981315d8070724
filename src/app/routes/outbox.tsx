import { lazy } from 'react';
import { RequireSignedIn } from '../../features/account/components/require-signed-in';

// the page's own chunk loads only once the account check has passed
const OutboxPage = lazy(() => import('../../features/review/components/outbox-page'));

export default function OutboxRoute() {
  return (
    <RequireSignedIn roles={['moderator', 'admin']} what="the outbox">
      <OutboxPage />
    </RequireSignedIn>
  );
}
