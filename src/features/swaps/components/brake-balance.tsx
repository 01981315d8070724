import type { SwapData } from '@shared/schemas/swap-data';
import { brakeBalanceOf } from '@shared/fitment/swap-checks';
import { useUnits } from '../../../lib/units';
import { Figure, Verdict } from '../../../components/verdict';
import { SheetSection } from './sheet-section';

const pct = (share: number) => `${(share * 100).toFixed(1)} %`;

export function BrakeBalanceSection({ data }: { data: SwapData }) {
  const { torque, pressure } = useUnits();
  const balance = brakeBalanceOf(data);
  if (!balance) return null;
  return (
    <SheetSection id="balance" title="Brake balance">
      <div className="grid items-start gap-3 sm:grid-cols-3">
        <Figure
          label="Front share before"
          value={pct(balance.frontShareBefore)}
          note={`Front ${torque(balance.torqueNm.before.front)} · rear ${torque(balance.torqueNm.before.rear)} per wheel`}
        />
        <Figure
          label="Front share after"
          value={pct(balance.frontShareAfter)}
          note={`Front ${torque(balance.torqueNm.after.front)} · rear ${torque(balance.torqueNm.after.rear)} per wheel`}
        />
        <Verdict
          label="Shift toward the front"
          ok={null}
          value={`${balance.shiftPoints >= 0 ? '+' : ''}${balance.shiftPoints.toFixed(1)} points`}
          note={
            balance.attention
              ? 'A large shift: the rear may now be under-braked or the fronts lock early. Check balance on a safe surface; a proportioning change may be needed.'
              : 'A modest shift; still check the car stops straight and the fronts do not lock first.'
          }
          rule={`Static share of brake torque with equal line pressure (${pressure(balance.linePressureBar)}) and pad μ ${balance.padMu}; disc-brake textbook formula T = 2 μ p A r.`}
        />
      </div>
    </SheetSection>
  );
}
