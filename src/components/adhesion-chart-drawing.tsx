import { CartesianGrid, Line, LineChart, ReferenceArea, ReferenceDot, ReferenceLine, XAxis, YAxis } from 'recharts';
import { PASSENGER_CAR_REFERENCE } from '@shared/fitment/distribution-analysis';
import type { AdhesionChartProps } from './adhesion-chart';
import { CHART_COLOURS, CHART_HEIGHT } from './adhesion-chart-style';

const Y_TOP = 1.2;
const ticks = (top: number) => Array.from({ length: Math.floor(top / 0.2 + 1e-9) + 1 }, (_, i) => Math.round(i * 2) / 10);

/** The SVG itself, loaded on demand by AdhesionChart. */
export default function AdhesionChartDrawing({ sets, maxG }: AdhesionChartProps) {
  const band = PASSENGER_CAR_REFERENCE;
  const lineEnd = 0.1 + 0.85 * (band.minimumLine.toK - 0.2);
  return (
    <LineChart
      responsive
      style={{ width: '100%', height: CHART_HEIGHT }}
      margin={{ top: 8, right: 12, bottom: 18, left: 0 }}
      accessibilityLayer={false}
    >
      <CartesianGrid stroke="#5c5a52" strokeOpacity={0.15} />
      <ReferenceArea
        x1={band.frontAboveRear.fromG}
        x2={Math.min(band.frontAboveRear.toG, maxG)}
        y1={0}
        y2={Y_TOP}
        fill={CHART_COLOURS.band}
        fillOpacity={0.55}
        ifOverflow="hidden"
      />
      <XAxis
        type="number"
        dataKey="z"
        domain={[0, maxG]}
        ticks={ticks(maxG)}
        allowDataOverflow
        tick={{ fontSize: 11, fill: '#2b2b28' }}
        label={{ value: 'Deceleration z (g)', position: 'insideBottom', offset: -10, fontSize: 11, fill: '#2b2b28' }}
      />
      <YAxis
        type="number"
        domain={[0, Y_TOP]}
        ticks={ticks(Y_TOP)}
        allowDataOverflow
        width={44}
        tick={{ fontSize: 11, fill: '#2b2b28' }}
        label={{ value: 'Friction needed', angle: -90, position: 'insideLeft', offset: 12, fontSize: 11, fill: '#2b2b28' }}
      />
      <ReferenceLine
        segment={[
          { x: 0, y: 0 },
          { x: maxG, y: maxG },
        ]}
        stroke={CHART_COLOURS.ideal}
        strokeDasharray="2 3"
        ifOverflow="hidden"
      />
      <ReferenceLine
        segment={[
          { x: 0.1, y: band.minimumLine.fromK },
          { x: lineEnd, y: band.minimumLine.toK },
        ]}
        stroke={CHART_COLOURS.line}
        strokeWidth={1.5}
        ifOverflow="hidden"
      />
      {sets.flatMap((set) => {
        const dash = set.stage === 'before' ? '6 4' : undefined;
        const width = set.stage === 'before' ? 2 : 2.75;
        return [
          <Line
            key={`${set.stage}-front`}
            data={set.analysis.curve}
            dataKey="front"
            type="linear"
            stroke={CHART_COLOURS.front}
            strokeWidth={width}
            strokeDasharray={dash}
            dot={false}
            isAnimationActive={false}
          />,
          <Line
            key={`${set.stage}-rear`}
            data={set.analysis.curve}
            dataKey="rear"
            type="linear"
            stroke={CHART_COLOURS.rear}
            strokeWidth={width}
            strokeDasharray={dash}
            dot={false}
            isAnimationActive={false}
          />,
        ];
      })}
      {sets.map((set) =>
        set.analysis.lockTogetherG === null ? null : (
          <ReferenceDot
            key={`${set.stage}-together`}
            x={set.analysis.lockTogetherG}
            y={set.analysis.lockTogetherG}
            r={4}
            fill={set.stage === 'before' ? '#fffdf8' : '#2b2b28'}
            stroke="#2b2b28"
            ifOverflow="hidden"
          />
        ),
      )}
    </LineChart>
  );
}
