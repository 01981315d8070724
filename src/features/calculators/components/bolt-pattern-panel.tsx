import { adjacentStudSpacingMm, pcdFromAdjacentStuds } from '@shared/fitment/wheel';
import { Caution } from '../../../components/caution';
import { Select } from '../../../components/ui/field';
import { Figure } from '../../../components/verdict';
import { round, useUnits } from '../../../lib/units';
import { byField, Inputs, type CalcParams } from './calc-params';
import { FieldGrid, Panel, QuantityField, ResultGrid, Waiting } from './calc-form';

export const boltPatternKeys = ['lugs', 'studs', 'pcd'];

const CHORD_RULE = 'Adjacent studs are a chord of the pitch circle: PCD = spacing / sin(180° / lugs) (plane geometry)';
const LUG_COUNTS = [3, 4, 5, 6, 8, 10];
const EXAMPLE_PCD_MM = 112;

export function BoltPatternPanel({ params }: { params: CalcParams }) {
  const { length } = useUnits();
  const lugText = params.get('lugs') || '5';
  const lugs = Number(lugText);
  const toKey = byField({ lugCount: 'lugs', spacingMm: 'studs', pcdMm: 'pcd' });

  const forward = new Inputs(params);
  const spacing = forward.number('studs', 'adjacent stud spacing');
  const pcd = forward.run(() => pcdFromAdjacentStuds(lugs, spacing), toKey);

  const inverse = new Inputs(params);
  const pcdGiven = inverse.number('pcd', 'PCD');
  const spacingFromPcd = inverse.run(() => adjacentStudSpacingMm(lugs, pcdGiven), toKey);

  const nothing = pcd === null && spacingFromPcd === null;
  const invalid = Object.keys(forward.errors).length + Object.keys(inverse.errors).length > 0;
  const pattern = (pcdMm: number) => `${lugs}×${round(pcdMm, 1)}`;

  return (
    <Panel
      id="bolt-pattern"
      title="Bolt pattern"
      lead="Measure between the centres of two neighbouring studs to get the pitch circle diameter (PCD), or go the other way."
      keys={boltPatternKeys}
      form={
        <FieldGrid cols={3}>
          <Select
            label="Lug count"
            name="lugs"
            value={lugText}
            onChange={(e) => params.set('lugs', e.target.value === '5' ? '' : e.target.value)}
            error={forward.error('lugs') ?? inverse.error('lugs')}
          >
            {LUG_COUNTS.map((n) => (
              <option key={n} value={n}>
                {n} studs
              </option>
            ))}
          </Select>
          <QuantityField
            params={params}
            name="studs"
            label="Adjacent stud spacing"
            quantity="length"
            // the example is the stud spacing of the PCD field's example, for the lug count chosen
            placeholder={round(adjacentStudSpacingMm(lugs, EXAMPLE_PCD_MM), 2).replace(',', '')}
            hint="Centre to centre, neighbouring studs"
            error={forward.error('studs')}
          />
          <QuantityField
            params={params}
            name="pcd"
            label="Or: PCD"
            quantity="length"
            placeholder={String(EXAMPLE_PCD_MM)}
            hint="To find the stud spacing"
            error={inverse.error('pcd')}
          />
        </FieldGrid>
      }
      results={
        nothing ? (
          <Waiting missing={['adjacent stud spacing or a PCD']} invalid={invalid} />
        ) : (
          <>
            <ResultGrid>
              {pcd !== null && (
                <Figure label="Pitch circle diameter" value={length(pcd, 1)} note={`Bolt pattern ${pattern(pcd)} mm`} />
              )}
              {spacingFromPcd !== null && (
                <Figure label="Adjacent stud spacing" value={length(spacingFromPcd, 2)} note={`for ${pattern(pcdGiven)} mm`} />
              )}
            </ResultGrid>
            <p className="mt-3 text-xs text-graphite-soft">Rule: {CHORD_RULE}</p>
          </>
        )
      }
      caution={<Caution topics={['wheels']} />}
    />
  );
}
