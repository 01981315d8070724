import { useParams } from 'react-router';
import { can } from '@shared/roles';
import ChassisPage from '../../features/swaps/components/chassis-page';
import { useMe } from '../../features/account/api/get-me';
import { useChassisCarMarks } from '../../features/cars/components/car-checks';
import { ChassisDonors } from '../../features/graph/components/chassis-donors';
import { FollowButton } from '../../features/following/components/follow-button';

/** The chassis page, marking which swaps clear the member's own wheel on this chassis, with the donor parts that fit it; reviewers keep its stock figures. */
export default function ChassisRoute() {
  const { slug = '' } = useParams();
  const me = useMe();
  const marks = useChassisCarMarks(slug, Boolean(me.data?.user));
  return (
    <ChassisPage
      intro={() => marks.intro}
      cardNote={marks.intro ? marks.noteFor : undefined}
      donors={(chassisSlug) => <ChassisDonors slug={chassisSlug} />}
      canEditFigures={can(me.data?.user?.role, 'review')}
      follow={(c) => <FollowButton target={{ chassisSlug: c.slug }} what={`the ${c.label}`} signedIn={Boolean(me.data?.user)} />}
    />
  );
}
