import type { ReactNode } from 'react';
import { WarningIcon } from './ui/icons';

import type { JobTouches } from '@shared/fitment/swap-checks';

export type CautionTopic = 'brakes' | 'wheels' | 'fasteners' | 'structural' | 'suspension';

const lines: Record<CautionTopic, string[]> = {
  brakes: [
    'Brakes are safety critical. Bleed the system and confirm a firm pedal before the car moves.',
    'Bed in new pads as their maker describes, and check front/rear brake balance after changing caliper or rotor sizes.',
  ],
  wheels: [
    'Check clearance with the wheel you will actually run, turning lock to lock, before the first drive.',
    'Spacers change scrub radius and load on the hub bearings; keep enough thread engagement on every wheel bolt.',
  ],
  fasteners: [
    'Torque every fastener to the manufacturer’s value, wheel bolts in a star pattern, and re-check after the first drive.',
  ],
  structural: [
    'This job cuts, grinds or drills a part that carries braking or suspension loads. Remove no more than the record says, check for cracks, protect bare metal, and have the part inspected before the car moves.',
  ],
  suspension: ['Tighten suspension bushes and links with the car on its wheels, and have the alignment checked afterwards.'],
};

/** The cautions a record needs, from what its job touches (not from its category). */
export function cautionTopicsOf(t: JobTouches): CautionTopic[] {
  const topics: CautionTopic[] = [];
  if (t.brakes) topics.push('brakes');
  if (t.wheelFastening) topics.push('wheels');
  if (t.structural) topics.push('structural');
  if (t.suspension) topics.push('suspension');
  topics.push('fasteners');
  return topics;
}

/** The safety block shown wherever brakes, wheels or fasteners are concerned. */
export function Caution({
  topics = ['brakes', 'wheels', 'fasteners'],
  children,
}: {
  topics?: CautionTopic[];
  children?: ReactNode;
}) {
  return (
    <aside
      role="note"
      aria-label="Safety caution"
      // a caution, not a quotation: a full frame and a warning sign, never a bar down one side
      className="print-break-avoid rounded-lg border-2 border-oxide bg-oxide-soft px-4 py-3 text-sm text-graphite"
      data-caution
    >
      <p className="flex items-center gap-2 font-extrabold text-oxide">
        <WarningIcon className="h-5 w-5" />
        Safety first
      </p>
      <ul className="mt-1 list-disc space-y-1 pl-5 print:columns-2 print:gap-6 print:space-y-0">
        {topics
          .flatMap((t) => lines[t])
          .map((line) => (
            <li key={line}>{line}</li>
          ))}
        <li>
          Have the work inspected by a qualified technician. Many places require an inspection or approval of brake and wheel
          modifications before road use; local rules and the manufacturers’ specifications always come first.
        </li>
      </ul>
      {children}
    </aside>
  );
}
