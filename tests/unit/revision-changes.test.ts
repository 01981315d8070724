import { describe, expect, it } from 'vitest';
import { compareRevisions, compareWriteUps, summariseChanges, type RowChange } from '../../shared/revision-changes';
import { swapDataSchema, type SwapData, type SwapDataInput } from '../../shared/schemas/swap-data';

const record = (extra: Partial<SwapDataInput> = {}): SwapData =>
  swapDataSchema.parse({
    schemaVersion: 2,
    title: 'Vela four-piston calipers on the H31',
    parts: [
      {
        partId: 20,
        role: 'Front caliper',
        kind: 'caliper',
        name: 'Vela four-piston fixed caliper, left',
        partNumbers: ['OV-355-104-L'],
        quantity: 1,
      },
      { partId: 31, role: 'Rotor', kind: 'rotor', name: 'Regent 330 mm vented rotor', partNumbers: ['TR-330-28'], quantity: 2 },
    ],
    fasteners: [
      { id: 'fx-1', kind: 'caliper_mount', label: 'Caliper to bracket', thread: 'M12x1.5' },
      { id: 'fx-2', kind: 'bracket_mount', label: 'Bracket to knuckle', thread: 'M12x1.5' },
      { id: 'fx-3', kind: 'banjo', label: 'Hose to caliper', thread: 'M10x1' },
      { id: 'fx-4', kind: 'wheel', label: 'Wheel to hub', thread: 'M12x1.5' },
    ],
    torque: [
      { fastenerId: 'fx-1', nm: 85 },
      { fastenerId: 'fx-2', nm: 95 },
      { fastenerId: 'fx-3', nm: 9 },
      { fastenerId: 'fx-4', nm: 110 },
    ],
    wheel: {
      minDiameterIn: 16,
      caliperRadialProjectionMm: 12,
      caliperOutboardMm: 30,
      testedWheels: [
        { diameterIn: 16, widthIn: 7, offsetMm: 38, outcome: 'fits', radialClearanceMm: 6 },
        { diameterIn: 17, widthIn: 7.5, offsetMm: 35, outcome: 'fits', radialClearanceMm: 14 },
      ],
    },
    costs: [
      { route: 'as_built', item: 'Used calipers', amountMinor: 32000 },
      { route: 'budget', item: 'Used calipers', amountMinor: 25000 },
    ],
    tools: ['Torque wrench, 20–120 N·m', 'Flare-nut spanner 10 mm'],
    ...extra,
  });

const body = 'Bolt the bracket on first.\n\nBleed twice and bed the pads in.';
const compare = (a: SwapData, b: SwapData, bodyB = body) => compareRevisions({ data: a, body }, { data: b, body: bodyB });
const section = (r: ReturnType<typeof compare>, s: string) => r.sections.find((x) => x.section === s)?.rows ?? [];

describe('what changed between two revisions', () => {
  it('when a fastener is inserted ahead of the others and the torque lines are reordered, then only the new fastener shows as added and no torque reads as changed', () => {
    const before = record();
    const after = record({
      fasteners: [
        { id: 'fx-5', kind: 'guide_pin', label: 'Guide pins', thread: 'M8x1.25' },
        ...before.fasteners.map((f) => ({ ...f })),
      ],
      torque: [{ fastenerId: 'fx-5', nm: 28 }, ...[...before.torque].reverse()],
    });
    const rows = section(compare(before, after), 'fasteners');
    expect(rows).toEqual<RowChange[]>([
      {
        change: 'added',
        name: 'Guide pins',
        kind: 'Caliper guide pins',
        fields: [
          { label: 'Thread', before: null, after: { kind: 'text', text: 'M8x1.25' } },
          { label: 'Torque', before: null, after: { kind: 'torque', nm: 28 } },
        ],
      },
    ]);
  });

  it('when the wheel-bolt torque changes, then one row names the wheel bolts with the torque before and after in N·m', () => {
    const before = record();
    const after = record({ torque: before.torque.map((t) => (t.fastenerId === 'fx-4' ? { ...t, nm: 120 } : t)) });
    expect(section(compare(before, after), 'fasteners')).toEqual([
      {
        change: 'changed',
        name: 'Wheel to hub',
        kind: 'Wheel bolts or nuts',
        fields: [{ label: 'Torque', before: { kind: 'torque', nm: 110 }, after: { kind: 'torque', nm: 120 } }],
      },
    ]);
  });

  it('when a catalogue part is put first in the list, then the parts are paired by catalogue entry and only the new one is added', () => {
    const before = record();
    const after = record({
      parts: [
        {
          partId: 17,
          role: 'Adapter',
          kind: 'adapter',
          name: 'Northgate H31 radial bracket',
          partNumbers: ['NF-H31-VB'],
          quantity: 2,
        },
        ...before.parts,
      ],
    });
    const rows = section(compare(before, after), 'parts');
    expect(rows.map((r) => [r.change, r.name])).toEqual([['added', 'Northgate H31 radial bracket']]);
  });

  it('when a proposed part gains its catalogue entry, then it is paired by its part number and reads unchanged', () => {
    const before = record({
      parts: [{ role: 'Rotor', kind: 'rotor', name: 'Regent rotor', partNumbers: ['TR-330-28'], quantity: 2 }],
    });
    const after = record({
      parts: [{ partId: 31, role: 'Rotor', kind: 'rotor', name: 'Regent rotor', partNumbers: ['tr 330 28'], quantity: 2 }],
    });
    expect(section(compare(before, after), 'parts')).toEqual([
      {
        change: 'changed',
        name: 'Regent rotor',
        kind: 'Rotor',
        fields: [
          { label: 'Part numbers', before: { kind: 'text', text: 'TR-330-28' }, after: { kind: 'text', text: 'tr 330 28' } },
        ],
      },
    ]);
  });

  it('when two different catalogue parts share a part number, then they are not taken for the same part', () => {
    const before = record({
      parts: [{ partId: 20, role: 'Caliper', kind: 'caliper', name: 'Left caliper', partNumbers: ['OV-355'], quantity: 1 }],
    });
    const after = record({
      parts: [{ partId: 21, role: 'Caliper', kind: 'caliper', name: 'Left caliper', partNumbers: ['OV-355'], quantity: 1 }],
    });
    expect(section(compare(before, after), 'parts').map((r) => r.change)).toEqual(['added', 'removed']);
  });

  it('when a tested wheel is added and another gets a new measurement, then wheels are paired by their size', () => {
    const before = record();
    const wheel = before.wheel!;
    const after = record({
      wheel: {
        ...wheel,
        testedWheels: [
          { ...wheel.testedWheels[1]!, radialClearanceMm: 12.5 },
          { diameterIn: 15, widthIn: 6, offsetMm: 38, outcome: 'does_not_fit' },
          wheel.testedWheels[0]!,
        ],
      },
    });
    const rows = section(compare(before, after), 'wheel');
    expect(rows.map((r) => [r.change, r.name])).toEqual([
      ['changed', 'Tested wheel 17″ × 7.5″, ET35'],
      ['added', 'Tested wheel 15″ × 6″, ET38'],
    ]);
    expect(rows[0]!.fields).toEqual([
      { label: 'Measured gap to the barrel', before: { kind: 'length', mm: 14 }, after: { kind: 'length', mm: 12.5 } },
    ]);
  });

  it('when cost lines are reordered and their amounts change, then each is paired by its route and item', () => {
    const before = record();
    // the lines come back in the other order, and both amounts change
    const after = record({
      costs: [
        { ...before.costs[1]!, amountMinor: 27500 },
        { ...before.costs[0]!, amountMinor: 34000 },
      ],
    });
    const rows = section(compare(before, after), 'costs');
    expect(rows).toEqual([
      {
        change: 'changed',
        name: 'Used calipers (budget)',
        fields: [
          {
            label: 'Amount',
            before: { kind: 'money', minor: 25000, currency: 'EUR' },
            after: { kind: 'money', minor: 27500, currency: 'EUR' },
          },
        ],
      },
      {
        change: 'changed',
        name: 'Used calipers (as built)',
        fields: [
          {
            label: 'Amount',
            before: { kind: 'money', minor: 32000, currency: 'EUR' },
            after: { kind: 'money', minor: 34000, currency: 'EUR' },
          },
        ],
      },
    ]);
  });

  it('when a tool with a comma in its name is added, then it is one tool, named whole', () => {
    const before = record();
    const after = record({ tools: [...before.tools, 'Feeler gauges, 0.05–1 mm'] });
    expect(section(compare(before, after), 'job')).toEqual([
      { change: 'added', name: 'Tool: Feeler gauges, 0.05–1 mm', fields: [] },
    ]);
  });

  it('when nothing changed, then there is nothing to show', () => {
    const r = compare(record(), record());
    expect(r).toEqual({ sections: [], writeUp: [] });
    expect(summariseChanges(r)).toBe('No changes to the record’s content.');
  });

  it('when many things change, then nothing internal reaches the reader: no field paths, ids or positions', () => {
    const before = record();
    const after = record({
      title: 'Vela four-piston calipers on the Halden H31',
      parts: [...before.parts].reverse().map((p) => ({ ...p, quantity: p.quantity + 1 })),
      fasteners: before.fasteners.slice(1),
      torque: before.torque.slice(1).map((t) => ({ ...t, nm: t.nm + 5 })),
      brakes: null,
      spacers: [{ axle: 'front', thicknessMm: 10, hubCentric: true, mounting: 'bolt_on', quantity: 2 }],
    });
    const r = compare(before, after, `${body}\n\nRe-torque the wheel bolts after 50 km.`);
    const shown = JSON.stringify(
      r.sections.flatMap((s) => [s.title, ...s.rows.flatMap((row) => [row.name, ...row.fields.map((f) => f.label)])]),
    );
    for (const internal of ['fx-', 'partId', 'fastenerId', 'torque.', 'parts.', '"20"', '"31"', 'Mm"', 'schemaVersion'])
      expect(shown).not.toContain(internal);
    expect(r.sections.map((s) => s.title)).toEqual(['Title and summary', 'Parts', 'Wheel spacers', 'Fasteners and torque']);
    expect(summariseChanges(r)).toBe('Changed: title and summary; parts; wheel spacers; fasteners and torque; write-up.');
  });
});

describe('what changed in the write-up', () => {
  it('when a paragraph is reworded, then it reads as one reworded paragraph with the changed words marked', () => {
    const r = compareWriteUps(
      'Bolt the bracket on first.\n\nTorque the bolts to 110 N·m.',
      'Bolt the bracket on first.\n\nTorque the bolts to 120 N·m.\n\nRe-check after 50 km.',
    );
    expect(r).toEqual([
      {
        change: 'reworded',
        words: [
          { text: 'Torque the bolts to ', change: 'same' },
          { text: '110', change: 'removed' },
          { text: '120', change: 'added' },
          { text: ' N·m.', change: 'same' },
        ],
      },
      { change: 'added', text: 'Re-check after 50 km.' },
    ]);
  });

  it('when a paragraph is removed and line endings differ, then only the removed paragraph shows', () => {
    expect(compareWriteUps('One.\r\n\r\nTwo.\r\n\r\nThree.', 'One.\n\nThree.')).toEqual([{ change: 'removed', text: 'Two.' }]);
  });
});
