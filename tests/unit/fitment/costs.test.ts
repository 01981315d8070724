import { describe, it, expect } from 'vitest';
import fc from 'fast-check';
import { routeTotals, savingsAgainstNewKit, type CostLineAmount } from '../../../shared/fitment/costs';

describe('routeTotals', () => {
  it('adds integer minor units per route and leaves an empty route null', () => {
    // plain arithmetic on integer minor units
    const totals = routeTotals([
      { route: 'as_built', amountMinor: 18_000 },
      { route: 'as_built', amountMinor: 4_550 },
      { route: 'new_kit', amountMinor: 89_900 },
    ]);
    expect(totals).toEqual({ as_built: 22_550, budget: null, new_kit: 89_900 });
  });

  it('a route whose lines are all zero totals 0, not null', () => {
    expect(routeTotals([{ route: 'budget', amountMinor: 0 }])).toEqual({ as_built: null, budget: 0, new_kit: null });
    expect(routeTotals([])).toEqual({ as_built: null, budget: null, new_kit: null });
  });

  it('the totals equal the sum of the lines', () => {
    // plain arithmetic
    const line = fc.record({
      route: fc.constantFrom('as_built' as const, 'budget' as const, 'new_kit' as const),
      amountMinor: fc.integer({ min: 0, max: 100_000_000 }),
    });
    fc.assert(
      fc.property(fc.array(line, { maxLength: 40 }), (lines) => {
        const totals = routeTotals(lines);
        for (const route of ['as_built', 'budget', 'new_kit'] as const) {
          const mine = lines.filter((l) => l.route === route);
          expect(totals[route]).toBe(mine.length === 0 ? null : mine.reduce((s, l) => s + l.amountMinor, 0));
        }
      }),
    );
  });

  it('names the wrong line', () => {
    const ok: CostLineAmount = { route: 'budget', amountMinor: 100 };
    expect(() => routeTotals([ok, { route: 'budget', amountMinor: 12.5 }])).toThrow(
      expect.objectContaining({ field: 'lines.1.amountMinor' }),
    );
    expect(() => routeTotals([{ route: 'budget', amountMinor: -100 }])).toThrow(
      expect.objectContaining({ field: 'lines.0.amountMinor' }),
    );
    expect(() => routeTotals([{ route: 'budget', amountMinor: Number.NaN }])).toThrow(
      expect.objectContaining({ field: 'lines.0.amountMinor' }),
    );
    expect(() => routeTotals([ok, ok, { route: 'junkyard' as never, amountMinor: 100 }])).toThrow(
      expect.objectContaining({ field: 'lines.2.route' }),
    );
    expect(() =>
      routeTotals([
        { route: 'new_kit', amountMinor: Number.MAX_SAFE_INTEGER },
        { route: 'new_kit', amountMinor: 1 },
      ]),
    ).toThrow(expect.objectContaining({ field: 'lines.1.amountMinor' }));
    expect(() => routeTotals('lines' as never)).toThrow(expect.objectContaining({ field: 'lines' }));
  });
});

describe('savingsAgainstNewKit', () => {
  it('saving = new kit − route, percent of the new kit', () => {
    // plain arithmetic
    const s = savingsAgainstNewKit({ as_built: 22_550, budget: 11_000, new_kit: 89_900 });
    expect(s.as_built).toEqual({ amountMinor: 67_350, percent: (67_350 / 89_900) * 100 });
    expect(s.as_built?.percent).toBeCloseTo(74.917, 3);
    expect(s.budget).toEqual({ amountMinor: 78_900, percent: (78_900 / 89_900) * 100 });
    expect(s.new_kit).toEqual({ amountMinor: 0, percent: 0 });
  });

  it('a route dearer than the new kit shows a negative saving', () => {
    const s = savingsAgainstNewKit({ as_built: 120_000, budget: null, new_kit: 100_000 });
    expect(s.as_built).toEqual({ amountMinor: -20_000, percent: -20 });
    expect(s.budget).toBeNull();
  });

  it('nothing is computable without a new-kit total; percent needs a non-zero one', () => {
    expect(savingsAgainstNewKit({ as_built: 100, budget: 50, new_kit: null })).toEqual({
      as_built: null,
      budget: null,
      new_kit: null,
    });
    expect(savingsAgainstNewKit({ as_built: 100, budget: null, new_kit: 0 }).as_built).toEqual({
      amountMinor: -100,
      percent: null,
    });
  });

  it('works on the output of routeTotals', () => {
    const totals = routeTotals([
      { route: 'budget', amountMinor: 25_000 },
      { route: 'new_kit', amountMinor: 50_000 },
    ]);
    expect(savingsAgainstNewKit(totals).budget).toEqual({ amountMinor: 25_000, percent: 50 });
  });

  it('rejects non-integer totals', () => {
    expect(() => savingsAgainstNewKit({ as_built: 10.5, budget: null, new_kit: 100 })).toThrow(
      expect.objectContaining({ field: 'totals.as_built' }),
    );
    expect(() => savingsAgainstNewKit({ as_built: null, budget: null, new_kit: -1 })).toThrow(
      expect.objectContaining({ field: 'totals.new_kit' }),
    );
    expect(() => savingsAgainstNewKit(null as never)).toThrow(expect.objectContaining({ field: 'totals' }));
  });
});
