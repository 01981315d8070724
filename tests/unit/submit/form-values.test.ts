import { describe, expect, it } from 'vitest';
import {
  emptyFastener,
  emptyRotor,
  emptyValues,
  numberList,
  formPathOf,
  liveDataOf,
  parsePayload,
  toPayload,
  valuesFromData,
  type FormValues,
} from '../../../src/features/submit/lib/form-values';
import { heldListText, heldText, shownListText, shownText } from '../../../src/lib/quantity-text';
import { brakeBalanceOf, costSummaryOf } from '../../../shared/fitment/swap-checks';

function filled(): FormValues {
  const v = emptyValues();
  v.chassisId = '3';
  v.axle = 'front';
  v.category = 'brakes';
  v.body = 'Bolted on in an afternoon.';
  v.data.title = 'Vela four-piston calipers on the H31';
  v.data.parts[0] = {
    ...v.data.parts[0],
    role: 'front caliper',
    name: 'Vela four-piston caliper',
    partNumbers: 'OV-355-104-L, OV-355-104-R',
    cameOn: 'Orsino Vela 2.0\nOrsino Vela 2.4',
    quantity: '2',
  };
  v.data.hasAdapter = true;
  v.data.adapter = {
    name: 'Northgate bracket',
    maker: 'Northgate Fabrication',
    partNumber: 'NF-31-V4',
    hardwareIncluded: '2 × M10 bolts\n2 × washers',
    notes: '',
  };
  v.data.fasteners = [
    { ...emptyFastener('caliper_mount', []), label: 'caliper to bracket', thread: 'M10x1.25', nm: '85,5' },
    { ...emptyFastener('bracket_mount', [{ id: 'caliper-mount' }]), label: 'bracket to knuckle', nm: '95' },
  ];
  v.data.costs = [{ route: 'as_built', item: 'Calipers, used', amount: '240.50' }];
  v.data.tools = 'Torque wrench, 20–120 N·m\nFlare-nut spanner';
  return v;
}

describe('submission form values', () => {
  it('when the form is filled, then the payload passes the shared schema with numbers, lists and minor units', () => {
    const r = parsePayload(filled(), null);
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect(r.payload.chassisId).toBe(3);
    expect(r.payload.data.parts[0].partNumbers).toEqual(['OV-355-104-L', 'OV-355-104-R']);
    expect(r.payload.data.parts[0].cameOn).toEqual(['Orsino Vela 2.0', 'Orsino Vela 2.4']);
    expect(r.payload.data.adapter?.hardwareIncluded).toEqual(['2 × M10 bolts', '2 × washers']);
    expect(r.payload.data.schemaVersion).toBe(2);
    expect(r.payload.data.fasteners.map((f) => [f.id, f.kind])).toEqual([
      ['caliper-mount', 'caliper_mount'],
      ['bracket-mount', 'bracket_mount'],
    ]);
    expect(r.payload.data.torque[0]).toMatchObject({ fastenerId: 'caliper-mount', nm: 85.5 });
    expect(r.payload.data.costs[0].amountMinor).toBe(24050);
    // a tool's name may hold a comma: one tool per line
    expect(r.payload.data.tools).toEqual(['Torque wrench, 20–120 N·m', 'Flare-nut spanner']);
    expect(r.payload.data.wheel).toBeNull();
    expect(r.payload.data.parkingBrake).toBeNull();
  });

  it('when a saved record is loaded into the form, then saving it again gives the same record', () => {
    const first = parsePayload(filled(), null);
    if (!first.ok) throw new Error('fixture must parse');
    const again = parsePayload(
      valuesFromData(first.payload.data, first.payload.body, {
        ...emptyValues(),
        chassisId: '3',
        axle: 'front',
        category: 'brakes',
      }),
      null,
    );
    expect(again.ok && again.payload).toEqual(first.payload);
  });

  it('when fields are wrong, then each issue names the form field that shows it', () => {
    const v = filled();
    v.data.title = 'short';
    v.data.parts[0].quantity = '';
    v.data.costs[0].amount = 'lots';
    v.chassisId = '';
    const r = parsePayload(v, null);
    expect(r.ok).toBe(false);
    if (r.ok) return;
    const by = Object.fromEntries(r.issues.map((i) => [i.path, i.message]));
    expect(by['data.title']).toBe('A title of at least 8 characters');
    expect(by['data.parts.0.quantity']).toBe('Needed');
    expect(by['data.costs.0.amount']).toBe('Enter a number');
    expect(by.chassisId).toBe('Pick a chassis or propose a new one');
  });

  it('when the server names a list item or a minor-unit amount, then the error goes to the text box', () => {
    expect(formPathOf('data.parts.1.partNumbers.3')).toBe('data.parts.1.partNumbers');
    expect(formPathOf('data.costs.2.amountMinor')).toBe('data.costs.2.amount');
    expect(formPathOf('data.tools.0')).toBe('data.tools');
    expect(formPathOf('data.brakes.after.front.pistonsPerSideMm.1')).toBe('data.brakes.after.front.pistonsPerSideMm');
    expect(formPathOf('data.parts.0.name')).toBe('data.parts.0.name');
  });

  it('when a correction is saved, then only the slug, data and body are sent', () => {
    const payload = toPayload(filled(), 'vela-calipers-h31') as Record<string, unknown>;
    expect(Object.keys(payload).sort()).toEqual(['body', 'data', 'swapSlug']);
  });

  it('when only some sections read correctly, then the live figures use those and skip the rest', () => {
    const v = filled();
    v.data.hasBrakes = true;
    const empty = v.data.brakes.before.front;
    const corner = { ...empty, pistonsPerSideMm: '38; 42', rotorDiameterMm: '280', padHeightMm: '45' };
    v.data.brakes.before = { front: { ...empty, pistonsPerSideMm: '54', rotorDiameterMm: '256', padHeightMm: '40' }, rear: corner };
    v.data.brakes.after = { front: corner, rear: corner };
    v.data.costs.push({ route: 'new_kit', item: 'Kit', amount: 'half-typed,' });
    const live = liveDataOf(v.data);
    expect(live.brakes?.after.front).toMatchObject({ kind: 'disc', pistonsPerSideMm: [38, 42] });
    expect(brakeBalanceOf(live)).not.toBeNull();
    expect(live.costs).toHaveLength(1);
    expect(costSummaryOf(live).totals.as_built).toBe(24050);
    v.data.brakes.after.front.rotorDiameterMm = '';
    expect(liveDataOf(v.data).brakes).toBeNull();
  });

  it('when a list of pistons holds a decimal comma, then it stays one piston', () => {
    expect(numberList('38,1')).toEqual([38.1]);
    expect(numberList('38,1; 42')).toEqual([38.1, 42]);
    expect(numberList('40, 44')).toEqual([40, 44]);
    expect(numberList('40 44')).toEqual([40, 44]);
    expect(numberList('40;44')).toEqual([40, 44]);
  });

  it('when a tool name holds a comma and the record goes through the form, then the list is unchanged', () => {
    const first = parsePayload(filled(), null);
    if (!first.ok) throw new Error('fixture must parse');
    const again = valuesFromData(first.payload.data, first.payload.body);
    expect(again.data.tools.split('\n')).toEqual(['Torque wrench, 20–120 N·m', 'Flare-nut spanner']);
  });

  describe('inputs in the units the toggle names', () => {
    it('when a length is typed in inches, then the form holds mm and the record stores mm', () => {
      expect(heldText('13', 'length', 'imperial')).toBe('330.2'); // NIST SP 811 B.8: 1 in = 25.4 mm exactly
      expect(heldText('4,5', 'length', 'imperial')).toBe('114.3'); // NIST SP 811 B.8: 4.5 in = 114.3 mm
      const v = filled();
      v.data.rotors = [{ ...emptyRotor('front'), diameterMm: heldText('13', 'length', 'imperial') }];
      v.data.rotors[0].thicknessMm = heldText('1.1', 'length', 'imperial');
      const r = parsePayload(v, null);
      expect(r.ok && r.payload.data.rotors[0]).toMatchObject({ diameterMm: 330.2, thicknessMm: 27.94 }); // NIST SP 811 B.8
    });

    it('when torque and pressure are typed in lbf·ft and psi, then N·m and bar are held', () => {
      expect(heldText('80', 'torque', 'imperial')).toBe('108.4654'); // NIST SP 811 B.9: 1 lbf·ft = 1.355818 N·m
      expect(heldText('725', 'pressure', 'imperial')).toBe('49.987'); // NIST SP 811 B.9: 1 psi = 6.894757 kPa; 1 bar = 100 kPa
    });

    it('when held metric values are shown in imperial, then they read in in, lbf·ft and psi', () => {
      expect(shownText('330.2', 'length', 'imperial')).toBe('13'); // NIST SP 811 B.8
      expect(shownText('330', 'length', 'imperial')).toBe('12.9921'); // NIST SP 811 B.8: 330 / 25.4
      expect(shownText('85', 'torque', 'imperial')).toBe('62.69'); // NIST SP 811 B.9: 85 / 1.355818
      expect(shownText('50', 'pressure', 'imperial')).toBe('725.19'); // NIST SP 811 B.9: 5000 kPa / 6.894757
      expect(shownListText('38; 42', 'length', 'imperial')).toBe('1.4961; 1.6535'); // NIST SP 811 B.8
      expect(heldListText('1.5, 1.65', 'length', 'imperial')).toBe('38.1; 41.91'); // NIST SP 811 B.8
    });

    it('when the system is metric, then the text passes through untouched, half-typed or not', () => {
      for (const t of ['', '12,', '330.25', 'abc']) {
        expect(heldText(t, 'length', 'metric')).toBe(t);
        expect(shownText(t, 'length', 'metric')).toBe(t);
      }
    });

    it('when the input is empty or unreadable, then it stays so and the schema names the field', () => {
      expect(heldText('', 'length', 'imperial')).toBe('');
      expect(heldText('  ', 'torque', 'imperial')).toBe('');
      expect(heldText('thirteen', 'length', 'imperial')).toBe('thirteen');
      const v = filled();
      v.data.fasteners[0].nm = heldText('lots', 'torque', 'imperial');
      const r = parsePayload(v, null);
      expect(r.ok).toBe(false);
      if (!r.ok) expect(r.issues.map((i) => i.path)).toContain('data.fasteners.0.nm');
    });

    it('when a value typed in imperial is shown again, then it reads exactly as typed', () => {
      for (let i = 1; i <= 4000; i++) {
        const inches = (i * 0.0037).toFixed(4);
        expect(shownText(heldText(inches, 'length', 'imperial'), 'length', 'imperial')).toBe(String(Number(inches)));
        const lbfFt = (i * 0.13).toFixed(2);
        expect(shownText(heldText(lbfFt, 'torque', 'imperial'), 'torque', 'imperial')).toBe(String(Number(lbfFt)));
        const psi = (i * 1.07).toFixed(2);
        expect(shownText(heldText(psi, 'pressure', 'imperial'), 'pressure', 'imperial')).toBe(String(Number(psi)));
      }
    });

    it('when a shown imperial value is typed back as shown, then it moves by under 0.00005 in once and never again', () => {
      for (const mm of ['330', '12.7', '85.5', '0.35', '66.6', '114.3']) {
        const once = heldText(shownText(mm, 'length', 'imperial'), 'length', 'imperial');
        expect(Math.abs(Number(once) - Number(mm))).toBeLessThan(0.00005 * 25.4 + 0.00005); // shown to 0.0001 in, held to 0.0001 mm
        let again = once;
        for (let k = 0; k < 5; k++) again = heldText(shownText(again, 'length', 'imperial'), 'length', 'imperial');
        expect(again).toBe(once);
      }
    });
  });
});
