import { backspacingMm, spacerEffect, BACKSPACING_RULE } from '@shared/fitment/wheel';
import { Caution } from '../../../components/caution';
import { Figure } from '../../../components/verdict';
import { round, useUnits } from '../../../lib/units';
import { byField, Inputs, type CalcParams } from './calc-params';
import { FieldGrid, Panel, QuantityField, ResultGrid, SubHeading, Waiting, withSign } from './calc-form';

export const offsetKeys = ['width', 'et', 'spacer'];

const SLIP_ON_NOTE = 'Spacers beyond about 15–20 mm are usually the bolt-on kind (common practice, no source).';

export function OffsetPanel({ params }: { params: CalcParams }) {
  const { length } = useUnits();
  const inputs = new Inputs(params);
  const widthIn = inputs.number('width', 'rim width');
  const offsetMm = inputs.number('et', 'offset (ET)');
  const spacerMm = inputs.number('spacer', 'spacer', { optional: true });
  const result = inputs.run(
    () => ({ stockBackspacing: backspacingMm({ widthIn, offsetMm }), after: spacerEffect({ widthIn, offsetMm }, spacerMm) }),
    byField({ widthIn: 'width', offsetMm: 'et', spacerMm: 'spacer' }),
  );

  return (
    <Panel
      id="offset"
      title="Offset and spacer"
      lead="What a wheel spacer does to the effective offset, the backspacing and the track."
      keys={offsetKeys}
      form={
        <FieldGrid cols={3}>
          <QuantityField params={params} name="width" label="Rim width" unit="in" placeholder="8" error={inputs.error('width')} />
          <QuantityField
            params={params}
            name="et"
            label="Offset ET"
            unit="mm"
            placeholder="45"
            hint="Negative for a deep dish"
            signed
            error={inputs.error('et')}
          />
          <QuantityField
            params={params}
            name="spacer"
            label="Spacer"
            quantity="length"
            placeholder="15"
            hint="Per side; leave empty for none"
            error={inputs.error('spacer')}
          />
        </FieldGrid>
      }
      results={
        result ? (
          <>
            <ResultGrid>
              <Figure
                label="Effective offset"
                value={`ET${round(result.after.offsetMm, 2)}`}
                note={spacerMm > 0 ? `from ET${round(offsetMm, 2)}` : 'no spacer'}
              />
              <Figure
                label="Backspacing"
                value={length(result.after.backspacingMm, 1)}
                note={spacerMm > 0 ? `${length(result.stockBackspacing, 1)} without the spacer` : undefined}
              />
              <Figure label="Track change per axle" value={withSign(result.after.trackChangeMm, (v) => length(v, 1))} />
              <Figure label="Each wheel moves outboard" value={length(result.after.outboardMm, 1)} />
            </ResultGrid>
            <SubHeading>Rule applied</SubHeading>
            <p className="text-xs text-graphite-soft">{BACKSPACING_RULE}</p>
            {spacerMm > 15 && <p className="mt-2 text-sm font-semibold text-brass-deep">{SLIP_ON_NOTE}</p>}
          </>
        ) : (
          <Waiting missing={inputs.missing} invalid={Object.keys(inputs.errors).length > 0} />
        )
      }
      caution={<Caution topics={['wheels', 'fasteners']} />}
    />
  );
}
