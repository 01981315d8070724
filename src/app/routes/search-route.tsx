import SearchPage from '../../features/search/components/search-page';
import { ForMyCarSwitch } from '../../features/cars/components/for-my-car-switch';
import { useMe } from '../../features/account/api/get-me';

/** The search page with the "for my car" switch from the cars feature above it. */
export default function SearchRoute() {
  const me = useMe();
  return (
    <>
      <ForMyCarSwitch signedIn={Boolean(me.data?.user)} />
      <SearchPage />
    </>
  );
}
