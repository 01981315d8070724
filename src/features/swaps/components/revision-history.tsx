import { useState } from 'react';
import { Link, useNavigate } from 'react-router';
import type { RevisionSummary } from '@shared/schemas/views';
import { paths } from '../../../config/paths';
import { Button } from '../../../components/ui/button';
import { SheetSection } from './sheet-section';
import { dateOrDash } from '@shared/dates';

export function RevisionHistory({ slug, history, shown }: { slug: string; history: RevisionSummary[]; shown: number }) {
  const navigate = useNavigate();
  const numbers = history.map((h) => h.number);
  const [a, setA] = useState(numbers[1] ?? numbers[0]);
  const [b, setB] = useState(numbers[0]);
  return (
    <SheetSection id="history" title="Revision history">
      <ol className="space-y-1 text-sm">
        {history.map((h) => (
          <li key={h.number} className="flex flex-wrap gap-x-2">
            <Link
              to={paths.swapRevision(slug, h.number)}
              className={`font-bold underline ${h.number === shown ? 'text-brass-deep' : 'text-ink'}`}
              aria-current={h.number === shown ? 'page' : undefined}
            >
              Revision {h.number}
            </Link>
            <span className="text-graphite-soft">
              {h.status === 'approved' ? 'current' : 'replaced'} · by {h.author.name} · published {dateOrDash(h.approvedAt)}
            </span>
            {h.changeNote && (
              <p className="w-full whitespace-pre-line break-words pl-3 text-graphite">
                <span className="font-bold">What changed and why:</span> {h.changeNote}
              </p>
            )}
          </li>
        ))}
      </ol>
      {history.length > 1 && (
        <form
          className="no-print mt-3 flex flex-wrap items-end gap-2 text-sm"
          onSubmit={(e) => {
            e.preventDefault();
            navigate(paths.swapCompare(slug, a, b));
          }}
        >
          <RevisionPicker label="Compare" numbers={numbers} value={a} onChange={setA} />
          <RevisionPicker label="with" numbers={numbers} value={b} onChange={setB} />
          <Button type="submit" variant="secondary" disabled={a === b}>
            Show changes
          </Button>
        </form>
      )}
    </SheetSection>
  );
}

function RevisionPicker({
  label,
  numbers,
  value,
  onChange,
}: {
  label: string;
  numbers: number[];
  value: number;
  onChange: (n: number) => void;
}) {
  return (
    <label className="flex flex-col">
      <span className="font-bold">{label}</span>
      <select
        className="rounded border border-graphite/25 bg-paper-card px-2 py-1"
        value={value}
        onChange={(e) => onChange(Number(e.target.value))}
      >
        {numbers.map((n) => (
          <option key={n} value={n}>
            Revision {n}
          </option>
        ))}
      </select>
    </label>
  );
}
