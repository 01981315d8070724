import type { BrakeSetup, DistributionComparison, DistributionInput, SetupAnalysis } from './distribution-types';

// The analysis in one sentence: which way the change moves the balance and which axle locks first where.

const g2 = (z: number) => `${z.toFixed(2)} g`;
const pct = (share: number) => `${(share * 100).toFixed(1)} %`;

function rearFirstClause(setup: SetupAnalysis): string | null {
  const parts = setup.states
    .filter((s) => s.rearFirstFromG !== null)
    .map((s) =>
      s.rearFirstFromG! < 0.005 ? `at any deceleration when ${s.state}` : `above ${g2(s.rearFirstFromG!)} when ${s.state}`,
    );
  return parts.length ? parts.join(' and ') : null;
}

function earliestRearFirst(setup: SetupAnalysis): number {
  return Math.min(...setup.states.map((s) => s.rearFirstFromG ?? Infinity));
}

function statesText(setup: SetupAnalysis): string {
  return setup.states.length === 2 ? 'laden and unladen' : setup.states[0].state;
}

function advice(before: BrakeSetup, after: BrakeSetup, beforeSetup: SetupAnalysis, afterSetup: SetupAnalysis): string {
  const rearGrew = afterSetup.rearAxleNPerBar > beforeSetup.rearAxleNPerBar * 1.005;
  const frontShrank = afterSetup.frontAxleNPerBar < beforeSetup.frontAxleNPerBar * 0.995;
  const valveFix =
    after.rearValve.kind === 'proportioning' || after.rearValve.kind === 'load-sensing'
      ? "lower the rear valve's knee"
      : before.rearValve.kind !== 'none' && before.rearValve.kind !== after.rearValve.kind
        ? 'refit the rear valve'
        : 'fit a proportioning valve';
  if (rearGrew) return `${valveFix} or keep the stock rear brakes`;
  if (frontShrank) return `${valveFix} or keep the stock front brakes`;
  return `${valveFix} or return to the stock balance`;
}

export function summarise(
  input: DistributionInput,
  before: SetupAnalysis,
  after: SetupAnalysis | null,
  comparison: DistributionComparison | null,
  maxG: number,
): string {
  if (!after || !comparison || !input.after) {
    const rear = rearFirstClause(before);
    return rear
      ? `The rear locks first ${rear} — check the rear valve and the brake balance before driving hard.`
      : `The front locks first up to ${g2(maxG)} ${statesText(before)}, the stable order.`;
  }
  const shares = `front share ${pct(comparison.frontShareBefore)} → ${pct(comparison.frontShareAfter)}`;
  const change = input.change ?? 'The swap';
  const direction =
    comparison.direction === 'front'
      ? `${change} moves the balance toward the front (${shares})`
      : comparison.direction === 'rear'
        ? `${change} moves the balance toward the rear (${shares})`
        : `${change} leaves the front share about where it was (${shares})`;
  const rearAfter = rearFirstClause(after);
  const rearBefore = rearFirstClause(before);
  if (rearAfter) {
    if (rearBefore && earliestRearFirst(after) > earliestRearFirst(before) + 0.005) {
      return `${direction}: the rear still locks first ${rearAfter}, later than before (${rearBefore}).`;
    }
    const was = rearBefore ? ` (before it: ${rearBefore})` : '';
    return `${direction}: after it the rear locks first ${rearAfter}${was} — ${advice(input.before, input.after, before, after)}.`;
  }
  const still = rearBefore ? 'now' : 'still';
  return `${direction}: the front ${still} locks first up to ${g2(maxG)} ${statesText(after)}, the stable order.`;
}
