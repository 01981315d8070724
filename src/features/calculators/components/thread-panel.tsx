import { wheelFasteningChain, type FastenerKind, type SeatType, type WheelFasteningInput } from '@shared/fitment/fastening';
import { boltLengthWithSpacer, threadBasics, unifiedThreadBasics, type HubMaterial } from '@shared/fitment/threads';
import { MM_PER_IN } from '@shared/fitment/units';
import { fasteningCheckWords } from '@shared/fitment/swap-fastening';
import { Caution } from '../../../components/caution';
import { Figure } from '../../../components/verdict';
import { round, useUnits } from '../../../lib/units';
import { byField, Inputs, type CalcParams } from './calc-params';
import { ChoiceField, choiceOf, FieldGrid, Fieldset, Panel, QuantityField, ResultGrid, SubHeading, Waiting } from './calc-form';
import { FitCheckCard, type CheckWords } from '../../../components/fit-check-card';

export const threadKeys = [
  'thread',
  'fast',
  'seat',
  'ball',
  'seath',
  'washer',
  'bolt',
  'from',
  'stud',
  'nut',
  'nutc',
  'wseat',
  'wball',
  'clamp',
  'wbore',
  'tspacer',
  'smount',
  'smat',
  'hub',
  'depth',
  'hole',
  'behind',
  'spigot',
  'hbore',
];

const SPACER_RULE = 'A slip-on spacer of thickness t needs a bolt (or stud) at least t longer (common practice, no source)';

const fastenerOptions = [
  ['bolt', 'Wheel bolt into the hub'],
  ['stud_nut', 'Stud and nut'],
] as const;
const seatOptions = [
  ['cone60', '60° cone'],
  ['ball', 'Ball (radius seat)'],
  ['flat', 'Flat with washer'],
] as const;
const wheelSeatOptions = [['same', 'Same as the fastener'], ...seatOptions] as const;
const fromOptions = [
  ['under_head', 'Under the head'],
  ['seat_end', 'Where the seat ends'],
] as const;
const nutOptions = [
  ['open', 'Open nut'],
  ['closed', 'Closed (dome) nut'],
] as const;
const hubOptions = [
  ['steel', 'Steel'],
  ['aluminium', 'Aluminium'],
] as const;
const holeOptions = [
  ['blind', 'Blind'],
  ['through', 'Through'],
] as const;
const mountOptions = [
  ['slip_on', 'Slip-on'],
  ['bolt_on', 'Bolt-on (own studs or tapped holes)'],
] as const;
const spacerMaterialOptions = [
  ['aluminium', 'Aluminium'],
  ['steel', 'Steel'],
] as const;

const words: CheckWords = fasteningCheckWords;

export function ThreadPanel({ params }: { params: CalcParams }) {
  const { length } = useUnits();
  const fastener = choiceOf<FastenerKind>(params, 'fast', fastenerOptions);
  const seat = choiceOf<SeatType>(params, 'seat', seatOptions);
  const wheelSeatChoice = choiceOf<SeatType | 'same'>(params, 'wseat', wheelSeatOptions);
  const wheelSeat = wheelSeatChoice === 'same' ? seat : wheelSeatChoice;
  const from = choiceOf(params, 'from', fromOptions);
  const hub = choiceOf<HubMaterial>(params, 'hub', hubOptions);
  const mounting = choiceOf(params, 'smount', mountOptions);
  const spacerMaterial = choiceOf<HubMaterial>(params, 'smat', spacerMaterialOptions);
  const bolt = fastener === 'bolt';
  const needsSeatHeight = bolt && from === 'under_head' && seat !== 'flat';

  const inputs = new Inputs(params);
  const optional = (key: string, label: string) => (params.get(key).trim() === '' ? undefined : inputs.number(key, label));
  const thread = inputs.text('thread', 'thread');
  const clampMm = inputs.number('clamp', 'wheel below the seat');
  const boltLengthMm = bolt ? inputs.number('bolt', 'bolt length') : undefined;
  const studLengthMm = bolt ? undefined : inputs.number('stud', 'stud length');
  const nutThreadMm = bolt ? undefined : inputs.number('nut', 'nut thread length');
  const seatHeightMm = needsSeatHeight ? inputs.number('seath', seat === 'ball' ? 'ball seat height' : 'cone height') : undefined;
  const ballMm = seat === 'ball' ? inputs.number('ball', 'ball radius') : undefined;
  const wheelBallMm = wheelSeatChoice === 'ball' ? inputs.number('wball', 'wheel ball radius') : ballMm;
  const washerMm = seat === 'flat' ? optional('washer', 'washer') : undefined;
  const spacerMm = optional('tspacer', 'spacer');
  const depthMm = optional('depth', 'hub thread depth');
  const behindMm = optional('behind', 'space behind the hub');

  const input: WheelFasteningInput = {
    fastener,
    thread,
    seat: { type: seat, ballRadiusMm: ballMm, heightMm: seatHeightMm },
    wheelSeat: { type: wheelSeat, ballRadiusMm: wheelBallMm },
    wheelClampMm: clampMm,
    washerMm,
    hubMaterial: hub,
    spacer: spacerMm ? { mounting, thicknessMm: spacerMm, material: spacerMaterial } : null,
    boltLengthMm,
    boltLengthFrom: from,
    hubThreadDepthMm: depthMm,
    hole: depthMm === undefined ? undefined : choiceOf(params, 'hole', holeOptions),
    clearanceBehindHubMm: behindMm,
    studLengthMm,
    nutThreadMm,
    nutClosed: choiceOf(params, 'nutc', nutOptions) === 'closed',
    hubSpigotLengthMm: optional('spigot', 'hub spigot length'),
    hubBoreMm: optional('hbore', 'hub spigot diameter'),
    wheelBoreMm: optional('wbore', 'wheel centre bore'),
  };
  const result = inputs.run(
    () => {
      const chain = wheelFasteningChain(input);
      const t = chain.thread;
      const stressAreaMm2 =
        t.system === 'unified'
          ? unifiedThreadBasics(t.diameterMm / MM_PER_IN, t.tpi!).stressAreaIn2 * MM_PER_IN ** 2
          : threadBasics(t.diameterMm, t.pitchMm).stressAreaMm2;
      const slipOnMm = input.spacer?.mounting === 'slip_on' ? input.spacer.thicknessMm : 0;
      return {
        chain,
        stressAreaMm2,
        neededMm: bolt ? boltLengthWithSpacer(boltLengthMm!, slipOnMm) : null,
        slipOnMm,
      };
    },
    byField({
      thread: 'thread',
      'seat.heightMm': 'seath',
      'seat.ballRadiusMm': 'ball',
      'wheelSeat.ballRadiusMm': 'wball',
      wheelClampMm: 'clamp',
      washerMm: 'washer',
      boltLengthMm: 'bolt',
      stockLengthMm: 'bolt',
      studLengthMm: 'stud',
      nutThreadMm: 'nut',
      'spacer.thicknessMm': 'tspacer',
      spacerMm: 'tspacer',
      hubThreadDepthMm: 'depth',
      clearanceBehindHubMm: 'behind',
      hubSpigotLengthMm: 'spigot',
      hubBoreMm: 'hbore',
      wheelBoreMm: 'wbore',
    }),
  );

  const chain = result?.chain;
  return (
    <Panel
      id="thread"
      title="Wheel fastening chain"
      lead="Thread engagement from where the seat really ends, through wheel, spacer and hub: seat match, bottoming out, a bolt too long for what sits behind the hub, and how the wheel centres."
      keys={threadKeys}
      wide="results"
      form={
        <div className="flex flex-col gap-4">
          <Fieldset legend="Fastener">
            <FieldGrid>
              <QuantityField
                params={params}
                name="thread"
                label="Thread"
                text
                placeholder="M12x1.5"
                hint="Metric with pitch (M12x1.5) or unified with threads per inch (1/2-20 UNF)"
                error={inputs.error('thread')}
              />
              <ChoiceField params={params} name="fast" label="Fastener" options={fastenerOptions} />
              <ChoiceField params={params} name="seat" label="Seat" options={seatOptions} />
              {seat === 'ball' && (
                <QuantityField
                  params={params}
                  name="ball"
                  label="Ball radius"
                  quantity="length"
                  placeholder="13"
                  error={inputs.error('ball')}
                />
              )}
              {seat === 'flat' && (
                <QuantityField
                  params={params}
                  name="washer"
                  label="Washer"
                  quantity="length"
                  placeholder="2.5"
                  hint="Joins the clamped stack"
                  error={inputs.error('washer')}
                />
              )}
              {bolt ? (
                <>
                  <QuantityField
                    params={params}
                    name="bolt"
                    label="Bolt length"
                    quantity="length"
                    placeholder="45"
                    error={inputs.error('bolt')}
                  />
                  <ChoiceField params={params} name="from" label="Length measured from" options={fromOptions} />
                  {needsSeatHeight && (
                    <QuantityField
                      params={params}
                      name="seath"
                      label={seat === 'ball' ? 'Ball seat height' : 'Cone height'}
                      quantity="length"
                      placeholder="6"
                      hint="Under the head to where the seat ends; taken off the length"
                      error={inputs.error('seath')}
                    />
                  )}
                </>
              ) : (
                <>
                  <QuantityField
                    params={params}
                    name="stud"
                    label="Stud length"
                    quantity="length"
                    placeholder="38"
                    hint="Standing out of the hub face"
                    error={inputs.error('stud')}
                  />
                  <QuantityField
                    params={params}
                    name="nut"
                    label="Nut thread length"
                    quantity="length"
                    placeholder="14"
                    hint="From where the nut's seat ends"
                    error={inputs.error('nut')}
                  />
                  <ChoiceField params={params} name="nutc" label="Nut" options={nutOptions} />
                </>
              )}
            </FieldGrid>
          </Fieldset>
          <Fieldset legend="Wheel">
            <FieldGrid>
              <ChoiceField params={params} name="wseat" label="Wheel seat" options={wheelSeatOptions} />
              {wheelSeatChoice === 'ball' && (
                <QuantityField
                  params={params}
                  name="wball"
                  label="Wheel ball radius"
                  quantity="length"
                  placeholder="13"
                  error={inputs.error('wball')}
                />
              )}
              <QuantityField
                params={params}
                name="clamp"
                label="Wheel below the seat"
                quantity="length"
                placeholder="14"
                hint="From where the seat ends to the mounting face"
                error={inputs.error('clamp')}
              />
              <QuantityField
                params={params}
                name="wbore"
                label="Wheel centre bore"
                quantity="length"
                placeholder="66.6"
                hint="Optional"
                error={inputs.error('wbore')}
              />
            </FieldGrid>
          </Fieldset>
          <Fieldset legend="Spacer (optional)">
            <FieldGrid>
              <QuantityField
                params={params}
                name="tspacer"
                label="Spacer"
                quantity="length"
                placeholder="5"
                hint="Leave empty for none"
                error={inputs.error('tspacer')}
              />
              <ChoiceField params={params} name="smount" label="Mounting" options={mountOptions} />
              <ChoiceField params={params} name="smat" label="Spacer material" options={spacerMaterialOptions} />
            </FieldGrid>
          </Fieldset>
          <Fieldset legend="Hub">
            <FieldGrid>
              <ChoiceField params={params} name="hub" label="Hub material" options={hubOptions} />
              {bolt && (
                <>
                  <QuantityField
                    params={params}
                    name="depth"
                    label="Hub thread depth"
                    quantity="length"
                    placeholder="16"
                    hint="Optional; caps the engagement. Blind: closed behind; through: open behind"
                    error={inputs.error('depth')}
                  />
                  <ChoiceField params={params} name="hole" label="Hub hole" options={holeOptions} />
                  <QuantityField
                    params={params}
                    name="behind"
                    label="Space behind the hub"
                    quantity="length"
                    placeholder="8"
                    hint="Measured, to a parking-brake drum or dust shield"
                    error={inputs.error('behind')}
                  />
                </>
              )}
              <QuantityField
                params={params}
                name="spigot"
                label="Hub spigot length"
                quantity="length"
                placeholder="10"
                hint="Optional"
                error={inputs.error('spigot')}
              />
              <QuantityField
                params={params}
                name="hbore"
                label="Hub spigot diameter"
                quantity="length"
                placeholder="57.1"
                hint="Optional"
                error={inputs.error('hbore')}
              />
            </FieldGrid>
          </Fieldset>
        </div>
      }
      results={
        result && chain ? (
          <div className="flex flex-col gap-3">
            <Figure
              label={`Thread ${chain.thread.label}`}
              value={length(chain.thread.diameterMm, 2)}
              note={`${chain.thread.tpi ? `${chain.thread.tpi} threads per inch, ` : ''}pitch ${round(chain.thread.pitchMm, 3)} mm; stress area ${round(result.stressAreaMm2, 1)} mm² (${chain.thread.system === 'unified' ? 'ASME B1.1' : 'ISO 898-1'})`}
            />
            {chain.checks.map((check) =>
              check.id === 'engagement' ? (
                <FitCheckCard
                  key={check.id}
                  check={check}
                  words={words}
                  value={`${length(chain.engagement.engagementMm, 1)} · ${round(chain.engagement.turns, 1)} turns`}
                />
              ) : (
                <FitCheckCard key={check.id} check={check} words={words} />
              ),
            )}
            {chain.engagement.limitedBy === 'hub_thread' && (
              <p className="text-sm text-graphite-soft">
                The {chain.into === 'nut' ? 'nut' : 'hub'} thread ends before the {chain.into === 'nut' ? 'stud' : 'bolt'} does:
                engagement is its depth.
              </p>
            )}
            {chain.hubRing?.needed && (
              <Figure label="Hub-centric ring" value={chain.hubRing.label} note="outer Ø = wheel bore, inner Ø = hub spigot" />
            )}
            {bolt && result.neededMm !== null && (
              <>
                <SubHeading>Bolt length</SubHeading>
                <ResultGrid>
                  <Figure
                    label={result.slipOnMm > 0 ? 'Bolt needed with the spacer' : 'Bolt length (no spacer)'}
                    value={length(result.neededMm, 1)}
                    note={
                      result.slipOnMm > 0
                        ? `keeps the stock engagement: ${length(boltLengthMm!, 1)} + ${length(result.slipOnMm, 1)}`
                        : undefined
                    }
                  />
                  <Figure
                    label="Shortest bolt for the rule"
                    value={length(chain.seatAllowanceMm + chain.stackMm + chain.engagement.requiredMm, 1)}
                    note={`${chain.seatAllowanceMm > 0 ? 'seat + ' : ''}stack + required engagement`}
                  />
                  {input.hole === 'blind' && depthMm !== undefined && chain.into === 'hub' && (
                    <Figure
                      label="Longest bolt before it bottoms"
                      value={length(chain.seatAllowanceMm + chain.stackMm + depthMm, 1)}
                      note="shorter than this by a margin"
                    />
                  )}
                </ResultGrid>
                <p className="mt-1 text-xs text-graphite-soft">Rule: {SPACER_RULE}</p>
              </>
            )}
            {chain.notes.length > 0 && (
              <ul className="list-disc space-y-1 pl-5 text-sm text-graphite-soft">
                {chain.notes.map((n) => (
                  <li key={n}>{n}</li>
                ))}
              </ul>
            )}
          </div>
        ) : (
          <Waiting missing={inputs.missing} invalid={Object.keys(inputs.errors).length > 0} general={inputs.general} />
        )
      }
      caution={
        <Caution topics={['fasteners', 'wheels']}>
          {chain && chain.cautions.length > 0 && (
            <ul className="mt-2 list-disc space-y-1 pl-5 font-semibold text-oxide" data-chain-cautions>
              {chain.cautions.map((c) => (
                <li key={c}>{c}</li>
              ))}
            </ul>
          )}
        </Caution>
      }
    />
  );
}
