import { RequireSignedIn } from '../../features/account/components/require-signed-in';
import ReviewDeskPage from '../../features/review/components/review-desk-page';

export default function ReviewDeskRoute() {
  return (
    <RequireSignedIn permission="review" what="the review desk">
      <ReviewDeskPage />
    </RequireSignedIn>
  );
}
