import { shimStack, MAX_SHIM_PIECES } from '@shared/fitment/shims';
import { Caution } from '../../../components/caution';
import { Select } from '../../../components/ui/field';
import { Figure } from '../../../components/verdict';
import { useUnits } from '../../../lib/units';
import { byField, Inputs, type CalcParams } from './calc-params';
import { FieldGrid, Panel, QuantityField, ResultGrid, Waiting, withSign } from './calc-form';

export const shimKeys = ['gap', 'sizes', 'maxp'];

const DEFAULT_PIECES = 4;

export function ShimPanel({ params }: { params: CalcParams }) {
  const { length, system } = useUnits();
  const maxText = params.get('maxp') || String(DEFAULT_PIECES);
  const inputs = new Inputs(params);
  const gap = inputs.number('gap', 'target gap');
  const sizes = inputs.list('sizes', 'shim sizes');
  const stack = inputs.run(
    () => shimStack(gap, sizes, Number(maxText)),
    byField({ targetMm: 'gap', sizesMm: 'sizes', maxPieces: 'maxp' }),
  );

  return (
    <Panel
      id="shims"
      title="Shim stack"
      lead="The closest stack of centring shims to a measured gap, from the thicknesses you have, with the fewest pieces."
      keys={shimKeys}
      form={
        <FieldGrid>
          <QuantityField
            params={params}
            name="gap"
            label="Target gap"
            quantity="length"
            placeholder="2.3"
            error={inputs.error('gap')}
          />
          <Select
            label="At most"
            name="maxp"
            value={maxText}
            onChange={(e) => params.set('maxp', e.target.value === String(DEFAULT_PIECES) ? '' : e.target.value)}
            error={inputs.error('maxp')}
          >
            {Array.from({ length: MAX_SHIM_PIECES }, (_, i) => i + 1).map((n) => (
              <option key={n} value={n}>
                {n} {n === 1 ? 'piece' : 'pieces'}
              </option>
            ))}
          </Select>
          <QuantityField
            params={params}
            name="sizes"
            label="Shim sizes you have"
            quantity="length"
            list
            className="sm:col-span-2"
            placeholder={system === 'metric' ? '0.5, 1, 1.5' : '0.02, 0.04, 0.06'}
            hint="Thicknesses, comma-separated; each may be used more than once"
            error={inputs.error('sizes')}
          />
        </FieldGrid>
      }
      results={
        stack ? (
          <ResultGrid>
            <Figure
              label={`Stack (${stack.pieces.length} ${stack.pieces.length === 1 ? 'piece' : 'pieces'})`}
              value={stack.pieces.length ? stack.pieces.map((p) => length(p, 2)).join(' + ') : 'none'}
              note={stack.pieces.length === 0 ? 'No stack comes closer than leaving the gap open.' : 'thickest first'}
            />
            <Figure label="Stack total" value={length(stack.totalMm, 2)} />
            <Figure
              label="Against the gap"
              value={withSign(stack.errorMm, (v) => length(v, 2))}
              note={stack.errorMm > 0 ? 'thicker than the gap' : stack.errorMm < 0 ? 'thinner than the gap' : 'exact'}
            />
          </ResultGrid>
        ) : (
          <Waiting missing={inputs.missing} invalid={Object.keys(inputs.errors).length > 0} />
        )
      }
      caution={<Caution topics={['brakes', 'fasteners']} />}
    />
  );
}
