import { RequireSignedIn } from '../../features/account/components/require-signed-in';
import EditSubmissionPage from '../../features/submit/components/edit-submission-page';

export default function EditSubmissionRoute() {
  return (
    <RequireSignedIn permission="submit" what="your submission">
      <EditSubmissionPage />
    </RequireSignedIn>
  );
}
