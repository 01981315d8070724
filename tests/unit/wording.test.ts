import fs from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { chassisLabel, chassisName } from '../../shared/chassis-label';
import { dateOrDash, formatDate, formatDateTime, formatTime } from '../../shared/dates';
import { formatMoney } from '../../shared/money';
import { fittedByText } from '../../src/features/swaps/components/swap-sheet-page';

const root = path.resolve(import.meta.dirname, '../..');
const sourceFiles = (dir: string): string[] =>
  fs.readdirSync(path.join(root, dir), { withFileTypes: true }).flatMap((e) => {
    const rel = path.join(dir, e.name);
    if (e.isDirectory()) return sourceFiles(rel);
    return /\.tsx?$/.test(e.name) ? [rel] : [];
  });

describe('the words pages share', () => {
  it('when make, model and code repeat, then the chassis is named once; a code that adds something stays', () => {
    const h31 = { make: 'Halden', model: 'H31', code: 'H31', yearFrom: 1991, yearTo: 1999 };
    const vela = { make: 'Orsino', model: 'Vela', code: 'V3', yearFrom: 1998, yearTo: null };
    expect(chassisName(h31)).toBe('Halden H31');
    expect(chassisName({ ...h31, code: 'h31' })).toBe('Halden H31');
    expect(chassisName(vela)).toBe('Orsino Vela · V3');
    expect(chassisLabel(h31)).toBe('Halden H31 (1991–1999)');
    expect(chassisLabel(vela)).toBe('Orsino Vela (V3, 1998–on)');
  });

  it('when money is shown, then it is one Intl format with the currency sign, whatever the page', () => {
    expect(formatMoney(130000, 'EUR')).toBe('€1,300.00');
    expect(formatMoney(130050, 'EUR', { whole: true })).toBe('€1,301');
    expect(formatMoney(2400, 'GBP')).toBe('£24.00');
    // a currency Intl does not know is still written after the figure
    expect(formatMoney(2400, 'ZZZZ')).toBe('24.00 ZZZZ');
    const ownFormatters = [...sourceFiles('src'), ...sourceFiles('server')].filter((f) =>
      /style:\s*'currency'|currencyDisplay/.test(fs.readFileSync(path.join(root, f), 'utf8')),
    );
    expect(ownFormatters).toEqual([]);
  });

  it('when a date is shown, then it reads "6 Apr 2026" everywhere, with the time after it where it matters', () => {
    const at = new Date(2026, 3, 6, 14, 5);
    expect(formatDate(at)).toBe('6 Apr 2026');
    expect(formatDate(at.toISOString())).toBe('6 Apr 2026');
    expect(formatDateTime(at)).toBe('6 Apr 2026, 14:05');
    expect(formatDate(new Date(Date.UTC(2026, 8, 14)), { long: true, timeZone: 'UTC' })).toBe('14 September 2026');
    expect(dateOrDash(null)).toBe('—');
    expect(formatTime(at)).toBe('14:05');
    // no page formats a date or a time of its own
    const ownFormatters = [...sourceFiles('src'), ...sourceFiles('server'), ...sourceFiles('shared')].filter(
      (f) =>
        f !== path.join('shared', 'dates.ts') &&
        /toLocaleDateString|toLocaleTimeString|dateStyle|DateTimeFormat/.test(fs.readFileSync(path.join(root, f), 'utf8')),
    );
    expect(ownFormatters).toEqual([]);
  });

  it('when nobody else has reported fitting a swap, then the sheet says so in words, not "0 other members"', () => {
    expect(fittedByText(0)).toBe('No one else yet');
    expect(fittedByText(1)).toBe('1 other member');
    expect(fittedByText(3)).toBe('3 other members');
  });
});
