import type { SwapData } from '@shared/schemas/swap-data';
import { brakeBalanceOf } from '@shared/fitment/swap-checks';
import { useUnits } from '../../../lib/units';
import { Figure } from '../../../components/verdict';
import { BalanceShiftNote } from '../../../components/balance-shift-note';
import { SheetSection } from './sheet-section';

const pct = (share: number) => `${(share * 100).toFixed(1)} %`;

export function BrakeBalanceSection({ data }: { data: SwapData }) {
  const { torque, pressure } = useUnits();
  const balance = brakeBalanceOf(data);
  if (!balance) return null;
  return (
    <SheetSection id="balance" title="Brake balance">
      <BalanceShiftNote shift={balance.shift} />
      <div className="mt-3 grid items-start gap-3 sm:grid-cols-2 print:hidden">
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
      </div>
      <p className="mt-2 text-xs text-graphite-soft print:hidden">
        Static share of brake torque with equal line pressure ({pressure(balance.linePressureBar)}) and pad μ {balance.padMu};
        disc brake torque T = 2 μ p A r (textbook form).
      </p>
    </SheetSection>
  );
}
