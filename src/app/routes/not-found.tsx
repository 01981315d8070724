import { Page } from '../../components/ui/page';
import { ButtonLink } from '../../components/ui/button';

export default function NotFoundPage() {
  return (
    <Page
      title="Not found"
      heading="Nothing parked here"
      lead="The address may be mistyped, or the record was moved. Search finds every reviewed swap."
    >
      <div className="flex gap-3">
        <ButtonLink to="/search">Search swaps</ButtonLink>
        <ButtonLink to="/" variant="secondary">
          Home
        </ButtonLink>
      </div>
    </Page>
  );
}
