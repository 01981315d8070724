import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { mergeThreeWay } from '../../shared/revision-merge';

// Three-way merge of a correction (mine) with the revision approved since it started (theirs), against the
// revision both started from (base).

const base = {
  title: 'Vela calipers on the H31',
  torque: [
    { fastenerId: 'bracket', nm: 110 },
    { fastenerId: 'wheel', nm: 120 },
  ],
  brakes: { front: { rotorDiameterMm: 300, padHeightMm: 50 } },
  tools: ['12 mm socket'],
};

describe('mergeThreeWay', () => {
  it('when only the newer approval changed a field, then the merge takes it without asking', () => {
    const theirs = { ...base, torque: [{ fastenerId: 'bracket', nm: 95 }, base.torque[1]!] };
    const mine = { ...base, title: 'Vela four-piston calipers on the H31' };
    const out = mergeThreeWay(base, theirs, mine);
    expect(out.conflicts).toEqual([]);
    expect(out.value.torque[0]!.nm).toBe(95);
    expect(out.value.title).toBe('Vela four-piston calipers on the H31');
    expect(out.taken).toEqual(
      expect.arrayContaining([
        { path: 'torque[bracket].nm', base: '110', theirs: '95', mine: '110', from: 'theirs' },
        { path: 'title', base: base.title, theirs: base.title, mine: mine.title, from: 'mine' },
      ]),
    );
  });

  it('when both sides changed different rows of the same list, then each row keeps its own change', () => {
    const theirs = { ...base, torque: [{ fastenerId: 'bracket', nm: 95 }, base.torque[1]!] };
    const mine = { ...base, torque: [base.torque[0]!, { fastenerId: 'wheel', nm: 125 }] };
    const out = mergeThreeWay(base, theirs, mine);
    expect(out.conflicts).toEqual([]);
    expect(out.value.torque.map((r) => r.nm)).toEqual([95, 125]);
  });

  it('when the correction reordered the torque lines and the newer approval changed one, then the change lands on the same fastener', () => {
    const theirs = { ...base, torque: [{ fastenerId: 'bracket', nm: 95 }, base.torque[1]!] };
    const mine = { ...base, torque: [base.torque[1]!, base.torque[0]!] };
    const out = mergeThreeWay(base, theirs, mine);
    expect(out.conflicts).toEqual([]);
    expect(out.value.torque).toEqual([
      { fastenerId: 'wheel', nm: 120 },
      { fastenerId: 'bracket', nm: 95 },
    ]);
  });

  it('when one side added a torque line and the other changed another, then both are kept', () => {
    const theirs = { ...base, torque: [...base.torque, { fastenerId: 'banjo', nm: 9 }] };
    const mine = { ...base, torque: [{ fastenerId: 'bracket', nm: 100 }, base.torque[1]!] };
    const out = mergeThreeWay(base, theirs, mine);
    expect(out.conflicts).toEqual([]);
    expect(out.value.torque).toEqual([
      { fastenerId: 'bracket', nm: 100 },
      { fastenerId: 'wheel', nm: 120 },
      { fastenerId: 'banjo', nm: 9 },
    ]);
  });

  it('when one side removed a torque line the other changed, then it is a conflict over that line', () => {
    const theirs = { ...base, torque: [base.torque[0]!] };
    const mine = { ...base, torque: [base.torque[0]!, { fastenerId: 'wheel', nm: 125 }] };
    const out = mergeThreeWay(base, theirs, mine);
    expect(out.conflicts.map((c) => c.path)).toEqual(['torque[wheel]']);
    expect(mergeThreeWay(base, theirs, mine, { 'torque[wheel]': 'theirs' }).value.torque).toEqual([base.torque[0]]);
  });

  it('when both sides changed different rows of a list whose rows do not name themselves, then the whole list is one field', () => {
    const parts = [
      { name: 'Vela caliper', quantity: 2 },
      { name: 'Regent rotor', quantity: 2 },
    ];
    const theirs = { parts: [{ ...parts[0]!, quantity: 1 }, parts[1]!] };
    const mine = { parts: [parts[1]!, parts[0]!] };
    const out = mergeThreeWay({ parts }, theirs, mine);
    expect(out.conflicts.map((c) => c.path)).toEqual(['parts']);
  });

  it('when both sides changed the same figure differently, then it is a conflict that keeps the correction until a choice is made', () => {
    const theirs = { ...base, brakes: { front: { rotorDiameterMm: 300, padHeightMm: 46 } } };
    const mine = { ...base, brakes: { front: { rotorDiameterMm: 300, padHeightMm: 48 } } };
    const open = mergeThreeWay(base, theirs, mine);
    expect(open.conflicts).toEqual([{ path: 'brakes.front.padHeightMm', base: '50', theirs: '46', mine: '48' }]);
    expect(open.unresolved).toEqual(['brakes.front.padHeightMm']);
    expect(open.value.brakes.front.padHeightMm).toBe(48);

    const chosen = mergeThreeWay(base, theirs, mine, { 'brakes.front.padHeightMm': 'theirs' });
    expect(chosen.unresolved).toEqual([]);
    expect(chosen.value.brakes.front.padHeightMm).toBe(46);
  });

  it('when both sides made the same change, then there is nothing to decide', () => {
    const changed = { ...base, tools: ['12 mm socket', 'torque wrench'] };
    const out = mergeThreeWay(base, changed, structuredClone(changed));
    expect(out.conflicts).toEqual([]);
    expect(out.taken).toEqual([]);
    expect(out.value).toEqual(changed);
  });

  it('when the lists have different lengths on both sides, then the whole list is one field', () => {
    const theirs = { ...base, tools: ['12 mm socket', 'torque wrench'] };
    const mine = { ...base, tools: ['12 mm socket', 'bleed kit', 'brake cleaner'] };
    const out = mergeThreeWay(base, theirs, mine);
    expect(out.conflicts.map((c) => c.path)).toEqual(['tools']);
    expect(mergeThreeWay(base, theirs, mine, { tools: 'theirs' }).value.tools).toEqual(theirs.tools);
  });

  it('when one side removed an optional field and the other left it, then it is removed', () => {
    const withNote = { ...base, note: 'check the bleed screw points up' };
    const { note: _note, ...without } = withNote;
    void _note;
    const out = mergeThreeWay<Record<string, unknown>>(withNote, without, withNote);
    expect('note' in out.value).toBe(false);
    expect(out.taken).toEqual([{ path: 'note', base: withNote.note, theirs: null, mine: withNote.note, from: 'theirs' }]);
  });

  it('when both sides edited different paragraphs of a write-up, then the lines merge; when they edit the same line, it is a conflict', () => {
    const text = ['Torque the bracket bolts.', '', 'Bleed from the far corner.', '', 'Bed in the pads.', ''].join('\n');
    const theirs = text.replace('Torque the bracket bolts.', 'Torque the bracket bolts to 95 N·m.');
    const mine = text.replace('Bed in the pads.', 'Bed in the pads with ten stops from 60 km/h.');
    const merged = mergeThreeWay({ body: text }, { body: theirs }, { body: mine });
    expect(merged.conflicts).toEqual([]);
    expect(merged.value.body).toContain('to 95 N·m.');
    expect(merged.value.body).toContain('ten stops');
    expect(merged.taken.map((f) => [f.path, f.from])).toEqual([['body', 'both']]);

    const clash = mergeThreeWay({ body: text }, { body: theirs }, { body: text.replace('bracket bolts.', 'bracket bolts dry.') });
    expect(clash.conflicts.map((c) => c.path)).toEqual(['body']);
  });

  it('when any record is merged with an untouched side, then the result is the other side (property)', () => {
    const record = fc.dictionary(
      fc.constantFrom('a', 'b', 'c', 'd'),
      fc.oneof(fc.integer(), fc.string(), fc.array(fc.integer(), { maxLength: 3 }), fc.record({ x: fc.integer() })),
    );
    fc.assert(
      fc.property(record, record, (b, other) => {
        const a = mergeThreeWay(b, b, other);
        const c = mergeThreeWay(b, other, b);
        return (
          a.conflicts.length === 0 &&
          c.conflicts.length === 0 &&
          JSON.stringify(a.value) === JSON.stringify(other) &&
          JSON.stringify(c.value) === JSON.stringify(other)
        );
      }),
    );
  });

  it('when a choice is made for every conflict, then every field of the result comes from base, theirs or mine (property)', () => {
    const flat = fc.dictionary(fc.constantFrom('a', 'b', 'c'), fc.integer({ min: 0, max: 3 }));
    fc.assert(
      fc.property(flat, flat, flat, fc.boolean(), (b, t, m, pickTheirs) => {
        const first = mergeThreeWay(b, t, m);
        const choices = Object.fromEntries(first.conflicts.map((c) => [c.path, pickTheirs ? 'theirs' : 'mine'] as const));
        const out = mergeThreeWay(b, t, m, choices);
        if (out.unresolved.length) return false;
        return Object.keys({ ...b, ...t, ...m }).every((k) => {
          const v = (out.value as Record<string, number | undefined>)[k];
          const tv = t[k];
          const mv = m[k];
          if (tv === mv) return v === mv;
          if (b[k] === tv) return v === mv;
          if (b[k] === mv) return v === tv;
          return v === (pickTheirs ? tv : mv);
        });
      }),
    );
  });
});
