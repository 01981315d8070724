import { useMemo, useState } from 'react';
import type { SwapData } from '@shared/schemas/swap-data';
import type { Axle } from '@shared/schemas/enums';
import { checkWheelForSwap, wheelCheckSummary, type WheelUnderTest } from '@shared/fitment/swap-checks';
import { FitmentInputError } from '@shared/fitment/errors';
import { fasteningCheckWords, fastenerNoun, type FasteningChassis } from '@shared/fitment/swap-fastening';
import type { SeatSpec } from '@shared/fitment/fastening';
import type { SectionPoint } from '@shared/fitment/section';
import { inToMm, mmToIn } from '@shared/fitment/units';
import { useUnits } from '../../../lib/units';
import { Select, TextInput } from '../../../components/ui/field';
import { FitCheckCard } from '../../../components/fit-check-card';
import { useTypedInUnits } from '../../../lib/use-typed-in-units';
import { ClearanceCard, Figure, Verdict } from '../../../components/verdict';
import { SummaryLine, VerdictLine } from './wheel-check-verdict';
import { Button } from '../../../components/ui/button';
import { SheetSection } from './sheet-section';
import { numberKeyboard, readNumber } from '../../../lib/number-text';

export type WheelPreset = {
  label: string;
  wheel: { diameterIn: number; widthIn: number; offsetMm: number; spacerMm: number };
  /** the wheel's inside, when its owner has recorded it: drawn in the section check */
  insideProfile?: SectionPoint[] | null;
};

type Form = Record<
  'diameterIn' | 'widthIn' | 'offsetMm' | 'spacer' | 'barrel' | 'spokeInset' | 'seatType' | 'ballRadius' | 'clamp' | 'length',
  string
>;

const empty: Form = {
  diameterIn: '',
  widthIn: '',
  offsetMm: '',
  spacer: '0',
  barrel: '',
  spokeInset: '',
  seatType: '',
  ballRadius: '',
  clamp: '',
  length: '',
};
/** the figures typed in the chosen length unit; they convert when the toggle flips */
const lengths = {
  spacer: 'length',
  barrel: 'length',
  spokeInset: 'length',
  clamp: 'length',
  length: 'length',
  ballRadius: 'length',
} as const;

function parse(form: Form, imperial: boolean): { wheel?: WheelUnderTest; errors: Partial<Record<keyof Form, string>> } {
  const errors: Partial<Record<keyof Form, string>> = {};
  // nothing typed yet: no complaints, just the prompt
  const started = form.diameterIn.trim() !== '' || form.widthIn.trim() !== '' || form.offsetMm.trim() !== '';
  /** bounds in the field's stored unit; a length typed in inches is converted before it is compared */
  const num = (key: keyof Form, { required = false, min = -Infinity, max = Infinity, length = false } = {}) => {
    const typed = readNumber(form[key]);
    if (typed === undefined) {
      if (required && started) errors[key] = 'Needed for the check';
      return undefined;
    }
    if (!Number.isFinite(typed)) {
      errors[key] = 'Enter a number';
      return undefined;
    }
    const v = length && imperial ? inToMm(typed) : typed;
    if (v < min || v > max) {
      const shown = (mm: number) => (length && imperial ? `${+mmToIn(mm).toFixed(2)} in` : length ? `${mm} mm` : String(mm));
      errors[key] = `Between ${shown(min)} and ${shown(max)}`;
    }
    return v;
  };
  const diameterIn = num('diameterIn', { required: true, min: 10, max: 24 });
  const widthIn = num('widthIn', { required: true, min: 4, max: 13 });
  const offsetMm = num('offsetMm', { required: true, min: -80, max: 80 });
  const spacer = num('spacer', { min: 0, max: 60, length: true }) ?? 0;
  const barrel = num('barrel', { min: 0, max: 660, length: true });
  const spokeInset = num('spokeInset', { min: -100, max: 200, length: true });
  const clamp = num('clamp', { min: 1, max: 60, length: true });
  const length = num('length', { min: 1, max: 150, length: true });
  const ballRadius = num('ballRadius', { min: 5, max: 30, length: true });
  if (form.seatType === 'ball' && ballRadius === undefined && !errors.ballRadius) errors.ballRadius = 'Give the ball’s radius';
  const wheelSeat: SeatSpec | null =
    form.seatType === 'cone60' || form.seatType === 'flat'
      ? { type: form.seatType }
      : form.seatType === 'ball' && ballRadius !== undefined
        ? { type: 'ball', ballRadiusMm: ballRadius }
        : null;
  if (Object.keys(errors).length || diameterIn === undefined || widthIn === undefined || offsetMm === undefined)
    return { errors };
  return {
    errors,
    wheel: {
      diameterIn,
      widthIn,
      offsetMm,
      spacerMm: spacer,
      barrelInnerDiameterMm: barrel,
      spokeInsetMm: spokeInset,
      fastening: { wheelSeat, clampMm: clamp, lengthMm: length },
    },
  };
}

/** "Check my wheel": the reader's wheel against this swap's measurements, each verdict with its margin and rule. */
export function WheelCheckPanel({
  data,
  axle,
  chassis,
  presets = [],
}: {
  data: SwapData;
  axle: Axle;
  chassis: FasteningChassis;
  presets?: WheelPreset[];
}) {
  const units = useUnits();
  const imperial = units.system === 'imperial';
  const [form, setForm] = useTypedInUnits<Form>(empty, lengths);
  const [showMeasured, setShowMeasured] = useState(false);
  const { wheel, errors } = useMemo(() => parse(form, imperial), [form, imperial]);
  const result = useMemo(() => {
    if (!wheel) return null;
    try {
      return { check: checkWheelForSwap(data, axle, chassis, wheel) };
    } catch (err) {
      if (err instanceof FitmentInputError) return { error: err.message };
      throw err;
    }
  }, [data, axle, chassis, wheel]);

  const set = (key: keyof Form) => (e: React.ChangeEvent<HTMLInputElement | HTMLSelectElement>) =>
    setForm((f) => ({ ...f, [key]: e.target.value }));
  const noun = chassis.wheelFastening ? fastenerNoun(chassis.wheelFastening) : 'bolt';
  const stud = chassis.wheelFastening?.fastener === 'stud_nut';
  const u = units.lengthUnit;
  const fill = (w: WheelPreset['wheel']) =>
    setForm((f) => ({
      ...f,
      diameterIn: String(w.diameterIn),
      widthIn: String(w.widthIn),
      offsetMm: String(w.offsetMm),
      spacer: imperial ? (w.spacerMm / 25.4).toFixed(2) : String(w.spacerMm),
    }));

  const summary = result?.check ? wheelCheckSummary(result.check) : null;
  return (
    <SheetSection id="check" title="Check my wheel">
      <VerdictLine summary={summary} error={result?.error ?? null} />
      <div className="rounded-xl border border-ink/15 bg-paper-card p-4 no-print">
        {presets.length > 0 && (
          <div className="mb-4 flex flex-wrap items-center gap-2 text-sm">
            <span className="font-bold">Fill from:</span>
            {presets.map((p) => (
              <Button key={p.label} variant="secondary" onClick={() => fill(p.wheel)}>
                {p.label}
              </Button>
            ))}
          </div>
        )}
        <form className="grid grid-cols-2 gap-3 sm:grid-cols-4" onSubmit={(e) => e.preventDefault()} aria-label="Your wheel">
          <TextInput
            label="Diameter (in)"
            inputMode="decimal"
            value={form.diameterIn}
            onChange={set('diameterIn')}
            error={errors.diameterIn}
            placeholder="16"
          />
          <TextInput
            label="Width (in)"
            inputMode="decimal"
            value={form.widthIn}
            onChange={set('widthIn')}
            error={errors.widthIn}
            placeholder="7"
          />
          <TextInput
            label="Offset ET (mm)"
            {...numberKeyboard(true)}
            value={form.offsetMm}
            onChange={set('offsetMm')}
            error={errors.offsetMm}
            placeholder="35"
          />
          <TextInput
            label={`Spacer (${u})`}
            inputMode="decimal"
            value={form.spacer}
            onChange={set('spacer')}
            error={errors.spacer}
          />
          {showMeasured && (
            <>
              <TextInput
                label={`Barrel inner Ø (${u})`}
                hint="At the caliper"
                inputMode="decimal"
                value={form.barrel}
                onChange={set('barrel')}
                error={errors.barrel}
              />
              <TextInput
                label={`Spoke inset (${u})`}
                hint="Spoke back face outboard of the hub face"
                {...numberKeyboard(true)}
                value={form.spokeInset}
                onChange={set('spokeInset')}
                error={errors.spokeInset}
              />
              <Select
                label="Wheel seat"
                hint={`Where the ${noun} seats in the wheel`}
                value={form.seatType}
                onChange={set('seatType')}
              >
                <option value="">Not known</option>
                <option value="cone60">60° cone</option>
                <option value="ball">Ball (radius)</option>
                <option value="flat">Flat</option>
              </Select>
              {form.seatType === 'ball' && (
                <TextInput
                  label={`Ball radius (${u})`}
                  inputMode="decimal"
                  value={form.ballRadius}
                  onChange={set('ballRadius')}
                  error={errors.ballRadius}
                  placeholder="13"
                />
              )}
              <TextInput
                label={`Wheel thickness at the ${noun} (${u})`}
                hint="From where the seat ends to the mounting face"
                inputMode="decimal"
                value={form.clamp}
                onChange={set('clamp')}
                error={errors.clamp}
              />
              <TextInput
                label={stud ? `Stud length out of the hub (${u})` : `Wheel-bolt length (${u})`}
                hint={stud ? 'Empty: the factory studs' : 'Empty: the factory bolts'}
                inputMode="decimal"
                value={form.length}
                onChange={set('length')}
                error={errors.length}
              />
            </>
          )}
        </form>
        <button
          type="button"
          className="mt-3 text-sm font-bold text-ink underline"
          aria-expanded={showMeasured}
          onClick={() => setShowMeasured((s) => !s)}
        >
          {showMeasured ? 'Hide my measurements' : 'I have measured my wheel and bolts'}
        </button>
      </div>

      <div className="mt-4" aria-live="polite">
        {!wheel ? (
          <p className="text-sm text-graphite-soft">Enter your wheel’s diameter, width and offset to see whether it clears.</p>
        ) : result && 'error' in result ? (
          <p role="alert" className="text-sm font-bold text-oxide">
            {result.error}
          </p>
        ) : result ? (
          <>
            {summary && <SummaryLine summary={summary} />}
            <div className="mt-3 grid gap-3 sm:grid-cols-2 lg:grid-cols-3">
              {result.check.minDiameter && (
                <Verdict
                  label="Wheel diameter"
                  ok={result.check.minDiameter.ok}
                  value={`${result.check.minDiameter.givenIn}″ (needs ≥ ${result.check.minDiameter.requiredIn}″)`}
                  rule={result.check.minDiameter.rule}
                  words={{ pass: 'Meets the minimum', fail: 'Below the minimum' }}
                />
              )}
              {result.check.radial ? (
                <ClearanceCard label="Caliper to barrel (radial)" figure={result.check.radial} />
              ) : (
                <Figure label="Caliper to barrel (radial)" value="Not checked" note="This record has no caliper measurements." />
              )}
              {result.check.spoke ? (
                <ClearanceCard label="Caliper to spokes (face)" figure={result.check.spoke} />
              ) : (
                <Figure
                  label="Caliper to spokes (face)"
                  value="Measure it"
                  note="No tested wheel to estimate from: enter your spoke inset under ‘I have measured’."
                />
              )}
              <Figure
                label="New offset"
                value={`ET${Math.round(result.check.offset.offsetMm * 10) / 10}`}
                note={`Backspacing ${units.length(result.check.offset.backspacingMm)} · track +${units.length(result.check.offset.trackChangeMm)} per axle`}
              />
              {result.check.fastening?.checks.map((c) => (
                <FitCheckCard key={c.id} check={c} words={fasteningCheckWords} />
              ))}
              {result.check.fastening?.engagement && (
                <Figure
                  label="Thread engaged"
                  value={`${units.length(result.check.fastening.engagement.engagementMm)} (${result.check.fastening.engagement.turns.toFixed(1)} turns)`}
                  note={
                    result.check.fastening.engagement.limitedBy === 'hub_thread'
                      ? 'Limited by the hub’s thread depth.'
                      : `Limited by the ${noun}’s length.`
                  }
                />
              )}
              {!result.check.fastening?.engagement && (
                <Figure
                  label={stud ? 'Stud length' : 'Wheel-bolt length'}
                  value={
                    result.check.fastening?.lengthWithSpacerMm
                      ? `${units.length(result.check.fastening.lengthWithSpacerMm)} to keep the stock engagement`
                      : wheel.spacerMm > 0
                        ? `Stock + ${units.length(result.check.offset.outboardMm)}`
                        : 'Stock length'
                  }
                  note={
                    <>
                      {result.check.boltNote}
                      {result.check.fastening && result.check.fastening.missing.length > 0 && (
                        <> For the thread check, enter {result.check.fastening.missing.join(', ')}.</>
                      )}
                      {!chassis.wheelFastening && ' The chassis has no wheel fastening on record, so the thread is not checked.'}
                      {result.check.fasteningError && ` ${result.check.fasteningError}`}
                    </>
                  }
                />
              )}
              {result.check.maxRotor && (
                <Verdict
                  label="Rotor size rule of thumb"
                  ok={null}
                  value={`${units.length(result.check.maxRotor.rotorMm, 0)} rotor, rule allows ≈ ${units.length(result.check.maxRotor.maxRotorMm, 0)}`}
                  note={
                    result.check.maxRotor.withinRule
                      ? 'Within the rule of thumb.'
                      : 'Larger than the rule of thumb suggests; the measured clearance above governs.'
                  }
                  rule={result.check.maxRotor.rule}
                />
              )}
              {result.check.spacerNote && <Figure label="Spacer type" value="Consider bolt-on" note={result.check.spacerNote} />}
            </div>
            {result.check.fastening && result.check.fastening.notes.length > 0 && (
              <ul className="mt-3 space-y-1 text-sm text-graphite-soft">
                {result.check.fastening.notes.map((n) => (
                  <li key={n}>{n}</li>
                ))}
              </ul>
            )}
            {result.check.fastening && result.check.fastening.cautions.length > 0 && (
              <ul className="mt-3 space-y-1 rounded-lg border border-oxide/40 bg-oxide-soft p-3 text-sm text-oxide" role="note">
                {result.check.fastening.cautions.map((c) => (
                  <li key={c}>{c}</li>
                ))}
              </ul>
            )}
          </>
        ) : null}
      </div>
    </SheetSection>
  );
}
