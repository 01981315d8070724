import { lazy, Suspense } from 'react';
import type { StateAnalysis } from '@shared/fitment/distribution-analysis';
import { PASSENGER_CAR_REFERENCE } from '@shared/fitment/distribution-analysis';
import { CHART_COLOURS, CHART_HEIGHT } from './adhesion-chart-style';

export type AdhesionChartSet = {
  /** 'before' draws dashed lines, 'after' solid ones */
  stage: 'before' | 'after';
  label: string;
  analysis: StateAnalysis;
};

export type AdhesionChartProps = {
  /** what the chart shows, e.g. "Unladen car" */
  title: string;
  sets: AdhesionChartSet[];
  maxG: number;
};

// The charting library is big; it loads with the first chart, never with the page that holds it.
const Drawing = lazy(() => import('./adhesion-chart-drawing'));

const g = (z: number) => `${z.toFixed(2)} g`;

/** The chart in words, for screen readers and for anyone who cannot read the lines. */
export function describeAdhesion({ title, sets, maxG }: AdhesionChartProps): string {
  const band = PASSENGER_CAR_REFERENCE.frontAboveRear;
  const parts = sets.map(({ label, analysis }) => {
    const order = analysis.lockOrder
      .map((s) => `${s.first === 'front' ? 'the front' : 'the rear'} locks first from ${g(s.fromG)} to ${g(s.toG)}`)
      .join(', then ');
    const together =
      analysis.lockTogetherG === null
        ? 'the axles do not lock together in this range'
        : `both lock together at ${g(analysis.lockTogetherG)}`;
    return `${label}: ${order}; ${together}.`;
  });
  return `${title}. Adhesion utilisation of the front and rear axle against deceleration from 0 to ${g(maxG)}. ${parts.join(' ')} The ideal line is where both axles need the same friction. Reference band: the front curve above the rear between ${band.fromG} and ${band.toG} g.`;
}

/** Adhesion utilisation of each axle against deceleration, before and after a change, with the ideal line and the reference band. */
export function AdhesionChart(props: AdhesionChartProps) {
  const { title, sets } = props;
  return (
    <figure className="print-break-avoid grid gap-2">
      <figcaption className="sr-only">{describeAdhesion(props)}</figcaption>
      <p className="text-sm font-extrabold text-ink" aria-hidden>
        {title}
      </p>
      <div aria-hidden data-adhesion-chart style={{ height: CHART_HEIGHT }} className="w-full min-w-0">
        <Suspense
          fallback={<div className="h-full w-full animate-pulse rounded-md bg-paper-deep/60 print:hidden" data-chart-loading />}
        >
          <Drawing {...props} />
        </Suspense>
      </div>
      <ul className="flex flex-wrap gap-x-4 gap-y-1 text-xs text-graphite" aria-hidden>
        {sets.map((set) => (
          <li key={`${set.stage}-front`} className="flex items-center gap-1.5">
            <Swatch colour={CHART_COLOURS.front} dashed={set.stage === 'before'} />
            Front, {set.label.toLowerCase()}
          </li>
        ))}
        {sets.map((set) => (
          <li key={`${set.stage}-rear`} className="flex items-center gap-1.5">
            <Swatch colour={CHART_COLOURS.rear} dashed={set.stage === 'before'} />
            Rear, {set.label.toLowerCase()}
          </li>
        ))}
        <li className="flex items-center gap-1.5">
          <Swatch colour={CHART_COLOURS.ideal} dotted />
          Ideal: both axles need the same
        </li>
        <li className="flex items-center gap-1.5">
          <span className="inline-block h-3 w-5 rounded-sm border border-ink/30" style={{ background: CHART_COLOURS.band }} />
          Reference band ({PASSENGER_CAR_REFERENCE.frontAboveRear.fromG}–{PASSENGER_CAR_REFERENCE.frontAboveRear.toG} g)
        </li>
        <li className="flex items-center gap-1.5">
          <Swatch colour={CHART_COLOURS.line} />
          Minimum-deceleration line
        </li>
      </ul>
    </figure>
  );
}

function Swatch({ colour, dashed = false, dotted = false }: { colour: string; dashed?: boolean; dotted?: boolean }) {
  return (
    <svg width="24" height="8" viewBox="0 0 24 8" aria-hidden>
      <line
        x1="0"
        y1="4"
        x2="24"
        y2="4"
        stroke={colour}
        strokeWidth={dotted ? 1.5 : 2.5}
        strokeDasharray={dotted ? '2 3' : dashed ? '6 4' : undefined}
      />
    </svg>
  );
}
