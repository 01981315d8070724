import { RequireSignedIn } from '../../features/account/components/require-signed-in';
import SubmitPage from '../../features/submit/components/submit-page';

export default function SubmitRoute() {
  return (
    <RequireSignedIn permission="submit" what="the submission form">
      <SubmitPage />
    </RequireSignedIn>
  );
}
