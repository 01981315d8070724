import {
  boltLengthWithSpacer,
  parseMetricThread,
  threadEngagement,
  ENGAGEMENT_FACTOR,
  type HubMaterial,
} from '@shared/fitment/threads';
import { Caution } from '../../../components/caution';
import { Select } from '../../../components/ui/field';
import { Figure, Verdict } from '../../../components/verdict';
import { round, useUnits } from '../../../lib/units';
import { byField, Inputs, type CalcParams } from './calc-params';
import { FieldGrid, Panel, QuantityField, ResultGrid, SubHeading, Waiting, withSign } from './calc-form';

export const threadKeys = ['thread', 'bolt', 'clamp', 'tspacer', 'hub'];

const SPACER_RULE = 'A slip-on spacer of thickness t needs a bolt (or stud) at least t longer (common practice, no source)';

export function ThreadPanel({ params }: { params: CalcParams }) {
  const { length } = useUnits();
  const hub: HubMaterial = params.get('hub') === 'aluminium' ? 'aluminium' : 'steel';
  const inputs = new Inputs(params);
  const thread = inputs.text('thread', 'thread');
  const boltLengthMm = inputs.number('bolt', 'bolt length');
  const clampMm = inputs.number('clamp', 'clamped thickness');
  const spacerMm = inputs.number('tspacer', 'spacer', { optional: true });
  const result = inputs.run(
    () => {
      const { diameterMm, pitchMm } = parseMetricThread(thread);
      const neededMm = boltLengthWithSpacer(boltLengthMm, spacerMm);
      const engagement = threadEngagement({ diameterMm, pitchMm, boltLengthMm, clampedMm: clampMm + spacerMm, hubMaterial: hub });
      return { diameterMm, pitchMm, neededMm, engagement };
    },
    byField({
      thread: 'thread',
      diameterMm: 'thread',
      pitchMm: 'thread',
      boltLengthMm: 'bolt',
      stockLengthMm: 'bolt',
      clampedMm: 'clamp',
      spacerMm: 'tspacer',
    }),
  );

  return (
    <Panel
      id="thread"
      title="Thread engagement and bolt length"
      lead="How much of a wheel bolt is left in the hub once a spacer goes in, and how long a bolt the spacer needs."
      keys={threadKeys}
      form={
        <FieldGrid>
          <QuantityField
            params={params}
            name="thread"
            label="Thread"
            inputMode="text"
            placeholder="M12x1.5"
            hint="Metric with pitch, e.g. M12x1.5 or M14×1.5"
            error={inputs.error('thread')}
          />
          <Select
            label="Hub material"
            name="hub"
            value={hub}
            onChange={(e) => params.set('hub', e.target.value === 'steel' ? '' : e.target.value)}
          >
            <option value="steel">Steel</option>
            <option value="aluminium">Aluminium</option>
          </Select>
          <QuantityField
            params={params}
            name="bolt"
            label="Bolt length"
            quantity="length"
            placeholder="28"
            hint="Under the head to the tip, stock bolt"
            error={inputs.error('bolt')}
          />
          <QuantityField
            params={params}
            name="clamp"
            label="Clamped thickness"
            quantity="length"
            placeholder="14"
            hint="Wheel centre at the bolt seat, without the spacer"
            error={inputs.error('clamp')}
          />
          <QuantityField
            params={params}
            name="tspacer"
            label="Slip-on spacer"
            quantity="length"
            placeholder="5"
            hint="Leave empty for none"
            error={inputs.error('tspacer')}
          />
        </FieldGrid>
      }
      results={
        result ? (
          <>
            <Verdict
              label={`Thread engagement in a ${hub} hub`}
              ok={result.engagement.ok}
              words={{ pass: 'Enough thread', fail: 'Too little thread' }}
              value={`${length(result.engagement.engagementMm, 1)} · ${round(result.engagement.turns, 1)} turns`}
              margin={withSign(result.engagement.marginMm, (v) => length(v, 1))}
              note={`Needs ${length(result.engagement.requiredMm, 1)} (${ENGAGEMENT_FACTOR[hub]} × ${round(result.diameterMm, 1)} mm).`}
              rule={result.engagement.rule}
            />
            <SubHeading>Bolt length</SubHeading>
            <ResultGrid>
              <Figure
                label={spacerMm > 0 ? 'Bolt needed with the spacer' : 'Bolt length (no spacer)'}
                value={length(result.neededMm, 1)}
                note={
                  spacerMm > 0 ? `keeps the stock engagement: ${length(boltLengthMm, 1)} + ${length(spacerMm, 1)}` : undefined
                }
              />
              <Figure
                label="Shortest bolt for the rule"
                value={length(clampMm + spacerMm + result.engagement.requiredMm, 1)}
                note="clamped thickness + spacer + required engagement"
              />
            </ResultGrid>
            <p className="mt-3 text-xs text-graphite-soft">Rule: {SPACER_RULE}</p>
          </>
        ) : (
          <Waiting missing={inputs.missing} invalid={Object.keys(inputs.errors).length > 0} />
        )
      }
      caution={<Caution topics={['fasteners', 'wheels']} />}
    />
  );
}
