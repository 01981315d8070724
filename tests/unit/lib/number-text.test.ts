import { describe, expect, it } from 'vitest';
import { numberKeyboard, numberList, readNumber } from '../../../src/lib/number-text';

describe('numbers as people type them', () => {
  it('when a negative figure is typed with a typographic minus or a dash, then it reads as negative', () => {
    expect(readNumber('-12')).toBe(-12);
    expect(readNumber('−12,5')).toBe(-12.5);
    expect(readNumber('–7')).toBe(-7);
    expect(numberList('−3; 4')).toEqual([-3, 4]);
    expect(readNumber('12−')).toBeNaN();
  });

  it('when a field may be negative, then it asks the phone for a keyboard with a minus key, never the decimal pad', () => {
    expect(numberKeyboard(true).inputMode).toBe('text');
    expect(numberKeyboard(true)).toMatchObject({ autoCorrect: 'off', autoCapitalize: 'off', spellCheck: false });
    expect(numberKeyboard().inputMode).toBe('decimal');
  });
});
