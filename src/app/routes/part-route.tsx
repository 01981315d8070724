import PartPage from '../../features/swaps/components/part-page';
import { PartReach } from '../../features/graph/components/part-reach';

/** The part page, with the chassis the part reaches through approved swaps. */
export default function PartRoute() {
  return <PartPage reach={(partId) => <PartReach partId={partId} />} />;
}
