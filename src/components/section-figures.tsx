import { Figure } from './verdict';
import { useUnits } from '../lib/units';

// What would clear in the section check: the thinnest spacer and the largest rotor, worded the same on the sheet and the
// calculator. Spacers are rounded up and rotors down, so the figure shown always clears.

export function SpacerFigure({ spacer, onTry }: { spacer: number | null; onTry?: (mm: number) => void }) {
  const { lengthToward } = useUnits();
  if (spacer === null) {
    return (
      <Figure
        label="Thinnest spacer that clears"
        value="No spacer clears"
        note="The barrel governs: a spacer moves the wheel outboard, not outward. A smaller rotor, a lower caliper or another wheel is needed."
      />
    );
  }
  if (spacer === 0)
    return <Figure label="Thinnest spacer that clears" value="None needed" note="Clears 3 mm without a spacer." />;
  // Rounded up to the next step shown, so the figure given always clears.
  const shown = lengthToward(spacer, 'up');
  return (
    <Figure
      label="Thinnest spacer that clears"
      value={shown}
      note={
        <>
          Leaves 3 mm at the nearest point. Longer wheel bolts or studs are needed with it.{' '}
          {onTry && (
            <button
              type="button"
              className="font-bold text-ink underline print:hidden"
              onClick={() => onTry(Math.ceil(spacer * 2) / 2)}
            >
              Try it on the slider
            </button>
          )}
        </>
      }
    />
  );
}

export function RotorFigure({
  growth,
  rotorDiameterMm,
  spacerMm,
}: {
  growth: number | null;
  rotorDiameterMm?: number;
  spacerMm: number;
}) {
  const { length, lengthToward } = useUnits();
  const withSpacer = spacerMm > 0 ? ` with the ${length(spacerMm, 1)} spacer` : '';
  if (growth === null) {
    return (
      <Figure
        label="Largest rotor that fits"
        value="No rotor size clears"
        note={`The spokes govern${withSpacer}: a rotor size moves the caliper outward, not inboard. A spacer is needed.`}
      />
    );
  }
  if (rotorDiameterMm !== undefined) {
    const largest = rotorDiameterMm + 2 * growth;
    return (
      <Figure
        label="Largest rotor that fits"
        value={`${lengthToward(largest, 'down')} Ø`}
        note={
          growth >= 0
            ? `Your ${length(rotorDiameterMm, 0)} rotor has room to grow${withSpacer}, if the caliper moves out with its radius.`
            : `Your ${length(rotorDiameterMm, 0)} rotor is too large for 3 mm${withSpacer}.`
        }
      />
    );
  }
  return (
    <Figure
      label="Largest rotor that fits"
      value={`${growth >= 0 ? '+' : '−'}${lengthToward(Math.abs(growth), growth >= 0 ? 'down' : 'up')} on the radius`}
      note={`How much the rotor’s radius may grow${withSpacer} (negative: must shrink), with a radially mounted caliper moving out by as much. Enter the rotor Ø to see it as a diameter.`}
    />
  );
}
