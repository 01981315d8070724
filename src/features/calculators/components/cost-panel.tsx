import { routeTotals, savingsAgainstNewKit, COST_ROUTES, type CostLineAmount, type CostRoute } from '@shared/fitment/costs';
import { FitmentInputError } from '@shared/fitment/errors';
import { costRouteLabels } from '@shared/schemas/enums';
import { Button } from '../../../components/ui/button';
import { Select, TextInput } from '../../../components/ui/field';
import { Figure } from '../../../components/verdict';
import { readable, type CalcParams } from './calc-params';
import { Panel, Waiting } from './calc-form';
import { formatMoney } from '@shared/money';

export const costKeys = ['cost', 'cur'];

const CURRENCIES = ['EUR', 'GBP', 'USD', 'CHF', 'SEK', 'NOK', 'DKK', 'PLN', 'AUD', 'CAD', 'NZD'];
const MONEY = /^(\d{1,13})(?:[.,](\d{1,2}))?$/;

type Row = { route: CostRoute; amount: string; item: string };

// One query entry per line: route|amount|item (the item last, so it may hold any text).
const decode = (entry: string): Row => {
  const [route, amount = '', ...item] = entry.split('|');
  return {
    route: (COST_ROUTES as readonly string[]).includes(route) ? (route as CostRoute) : 'new_kit',
    amount,
    item: item.join('|'),
  };
};
const encode = (row: Row) => `${row.route}|${row.amount}|${row.item}`;

export function toMinor(text: string): number | null {
  const match = MONEY.exec(text.trim());
  if (!match) return null;
  return Number(match[1]) * 100 + Number((match[2] ?? '0').padEnd(2, '0'));
}

export function CostPanel({ params }: { params: CalcParams }) {
  const stored = params.getAll('cost').map(decode);
  const rows: Row[] = stored.length ? stored : [{ route: 'new_kit', amount: '', item: '' }];
  const currency = CURRENCIES.includes(params.get('cur')) ? params.get('cur') : 'EUR';

  const save = (next: Row[]) => params.setAll('cost', next.map(encode));
  const change = (i: number, patch: Partial<Row>) => save(rows.map((r, j) => (j === i ? { ...r, ...patch } : r)));

  const errors: Record<number, string> = {};
  const lines: CostLineAmount[] = [];
  const lineRow: number[] = [];
  let missing = 0;
  rows.forEach((row, i) => {
    if (row.amount.trim() === '') {
      if (row.item.trim() !== '') missing += 1;
      return;
    }
    const minor = toMinor(row.amount);
    if (minor === null) errors[i] = 'Enter an amount like 120 or 120.50 (no more than 2 decimals)';
    else {
      lines.push({ route: row.route, amountMinor: minor });
      lineRow.push(i);
    }
  });

  let totals = null;
  let savings = null;
  let general: string | null = null;
  if (Object.keys(errors).length === 0 && lines.length > 0) {
    try {
      totals = routeTotals(lines);
      savings = savingsAgainstNewKit(totals);
    } catch (error) {
      if (!(error instanceof FitmentInputError)) throw error;
      const index = /^lines\.(\d+)\./.exec(error.field);
      if (index) errors[lineRow[Number(index[1])]] = readable(error);
      else general = readable(error);
    }
  }

  return (
    <Panel
      id="costs"
      title="Cost routes"
      lead="Add up the parts by route — as built, budget, or all new — and see what each saves against buying the new kit."
      keys={costKeys}
      wide
      form={
        <div className="grid gap-3">
          <Select
            label="Currency"
            value={currency}
            onChange={(e) => params.set('cur', e.target.value === 'EUR' ? '' : e.target.value)}
            className="max-w-40"
          >
            {CURRENCIES.map((c) => (
              <option key={c}>{c}</option>
            ))}
          </Select>
          <ol className="grid gap-3">
            {rows.map((row, i) => (
              <li
                key={i}
                className="grid grid-cols-2 gap-2 rounded-lg border border-graphite/15 p-3 sm:grid-cols-[9rem_1fr_8rem_auto] sm:items-start sm:border-0 sm:p-0"
              >
                <Select
                  label={`Route, line ${i + 1}`}
                  value={row.route}
                  onChange={(e) => change(i, { route: e.target.value as CostRoute })}
                >
                  {COST_ROUTES.map((r) => (
                    <option key={r} value={r}>
                      {costRouteLabels[r]}
                    </option>
                  ))}
                </Select>
                <TextInput
                  label={`Item, line ${i + 1}`}
                  className="col-span-2 sm:col-span-1"
                  value={row.item}
                  placeholder="Rebuilt caliper pair"
                  onChange={(e) => change(i, { item: e.target.value.replace(/\|/g, '/') })}
                />
                <TextInput
                  label={`Amount, line ${i + 1}`}
                  value={row.amount}
                  inputMode="decimal"
                  className="tabular"
                  placeholder="120.00"
                  error={errors[i]}
                  onChange={(e) => change(i, { amount: e.target.value })}
                />
                <Button
                  variant="quiet"
                  className="self-end sm:mt-6 sm:self-start"
                  aria-label={`Remove line ${i + 1}`}
                  disabled={rows.length === 1 && !row.amount && !row.item}
                  onClick={() => save(rows.filter((_, j) => j !== i))}
                >
                  Remove
                </Button>
              </li>
            ))}
          </ol>
          <div>
            <Button
              variant="secondary"
              onClick={() => save([...rows, { route: rows[rows.length - 1]?.route ?? 'new_kit', amount: '', item: '' }])}
            >
              Add a line
            </Button>
          </div>
        </div>
      }
      results={
        totals && savings ? (
          <div className="grid gap-3">
            {COST_ROUTES.map((route) => {
              const total = totals[route];
              const saving = savings[route];
              if (total === null) return null;
              return (
                <Figure
                  key={route}
                  label={costRouteLabels[route]}
                  value={formatMoney(total, currency)}
                  note={
                    route === 'new_kit'
                      ? 'the baseline'
                      : saving === null
                        ? 'add a new kit line to compare'
                        : saving.amountMinor >= 0
                          ? `saves ${formatMoney(saving.amountMinor, currency)}${saving.percent !== null ? ` (${saving.percent.toFixed(1)} %)` : ''} against the new kit`
                          : `costs ${formatMoney(-saving.amountMinor, currency)} more than the new kit`
                  }
                />
              );
            })}
            <p className="text-xs text-graphite-soft">
              Amounts are added up in whole cents (pence, øre…), so the totals are exact.
            </p>
          </div>
        ) : (
          <Waiting
            missing={[missing ? 'an amount for each item' : 'at least one item with its amount']}
            invalid={Object.keys(errors).length > 0}
            general={general}
          />
        )
      }
    />
  );
}
