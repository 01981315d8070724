import { describe, expect, it } from 'vitest';
import { matchesChassis, type ChassisOption } from '../../../src/components/chassis-combobox';

// The chassis picker narrows by a typed year: every car built that year stays, the first and last years included.

const h31: ChassisOption = { slug: 'halden-h31', make: 'Halden', model: 'H31', code: 'H31', yearFrom: 1991, yearTo: 1999 };
const h40: ChassisOption = { slug: 'halden-h40', make: 'Halden', model: 'H40', code: 'H40', yearFrom: 1999, yearTo: 2007 };
const vela: ChassisOption = { slug: 'orsino-vela', make: 'Orsino', model: 'Vela', code: 'V3', yearFrom: 1994, yearTo: 2001 };
const regent: ChassisOption = {
  slug: 'tamsin-regent',
  make: 'Tamsin',
  model: 'Regent',
  code: 'TR2',
  yearFrom: 1995,
  yearTo: null,
};
const all = [h31, h40, vela, regent];
const picked = (text: string) => all.filter((c) => matchesChassis(c, text, 2026)).map((c) => c.slug);

describe('chassis picker, by year', () => {
  it.each([
    ['1991', ['halden-h31']],
    ['1999', ['halden-h31', 'halden-h40', 'orsino-vela', 'tamsin-regent']],
    ['2007', ['halden-h40', 'tamsin-regent']],
    ['1990', []],
  ])('when "%s" is typed, then exactly the cars built that year are offered (first and last years count)', (year, expected) => {
    expect(picked(year)).toEqual(expected);
  });

  it.each(['95', '’95', "'95"])('when the year is typed short ("%s"), then every car built in 1995 is offered', (text) => {
    expect(picked(text)).toEqual(['halden-h31', 'orsino-vela', 'tamsin-regent']);
  });

  it('when a short year is also part of a code (31 in H31), then the code still matches', () => {
    expect(picked('31')).toEqual(['halden-h31']);
  });

  it('when a range of years is typed, then cars built in any of them are offered', () => {
    expect(picked('2002-2006')).toEqual(['halden-h40', 'tamsin-regent']);
    expect(picked('1990–1992')).toEqual(['halden-h31']);
  });

  it('when a year is typed with a make, then both must fit', () => {
    expect(picked('halden 1995')).toEqual(['halden-h31']);
    expect(picked('orsino 2002')).toEqual([]);
  });

  it('when a car is still built (no last year), then this year finds it', () => {
    expect(picked('2026')).toEqual(['tamsin-regent']);
  });
});
