import { RequireSignedIn } from '../../features/account/components/require-signed-in';
import OutboxPage from '../../features/review/components/outbox-page';

export default function OutboxRoute() {
  return (
    <RequireSignedIn roles={['moderator', 'admin']} what="the outbox">
      <OutboxPage />
    </RequireSignedIn>
  );
}
