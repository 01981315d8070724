import { useEffect, useState, type RefObject } from 'react';
import { categories, categoryLabels, revisionStatusLabels } from '@shared/schemas/enums';
import { trustLevelLabels, trustLevels } from '@shared/trust';
import { checkOutcomeLabels, checkOutcomes, type ReviewQueueQuery } from '@shared/schemas/review-queue';
import { Field, Select, inputClass } from '../../../components/ui/field';
import { Button } from '../../../components/ui/button';
import { useChassisFilter } from '../api/get-chassis-filter';
import { chassisName } from '@shared/chassis-label';

type Props = {
  query: ReviewQueueQuery;
  /** a value of '' clears the filter */
  onChange: (key: keyof ReviewQueueQuery, value: string) => void;
  onClear: () => void;
  searchRef: RefObject<HTMLInputElement | null>;
};

/** The desk's filters; each one stands in the page's address, so a filtered desk can be bookmarked and shared. */
export function QueueFilters({ query, onChange, onClear, searchRef }: Props) {
  const chassis = useChassisFilter();
  const [words, setWords] = useState(query.q ?? '');
  // the address is the truth: going back in history puts its words in the box
  useEffect(() => setWords(query.q ?? ''), [query.q]);
  const filtered = Boolean(
    query.q || query.chassis || query.category || query.olderThanDays !== undefined || query.authorTrust || query.checks,
  );
  return (
    <div className="mb-4 rounded-xl border border-ink/10 bg-paper-card p-4" role="search" aria-label="Filter the queue">
      <form
        className="mb-3 flex flex-col gap-2 sm:flex-row sm:items-end"
        onSubmit={(e) => {
          e.preventDefault();
          onChange('q', words.trim());
        }}
      >
        <Field
          label="Search the queue"
          hint="Title, parts and part numbers, author, chassis. Every word must match."
          className="flex-1"
        >
          {(a11y) => (
            <input
              ref={searchRef}
              type="search"
              className={inputClass}
              value={words}
              maxLength={100}
              onChange={(e) => setWords(e.target.value)}
              {...a11y}
            />
          )}
        </Field>
        <Button type="submit" variant="secondary" className="sm:mb-5">
          Search
        </Button>
      </form>
      <div className="grid grid-cols-2 gap-3 lg:grid-cols-6">
        <Select label="Status" value={query.status} onChange={(e) => onChange('status', e.target.value)}>
          <option value="in_review">{revisionStatusLabels.in_review}</option>
          <option value="sent_back">{revisionStatusLabels.sent_back}</option>
        </Select>
        <Select label="Chassis" value={query.chassis ?? ''} onChange={(e) => onChange('chassis', e.target.value)}>
          <option value="">Any chassis</option>
          {(chassis.data ?? []).map((c) => (
            <option key={c.slug} value={c.slug}>
              {chassisName(c)}
            </option>
          ))}
        </Select>
        <Select label="Category" value={query.category ?? ''} onChange={(e) => onChange('category', e.target.value)}>
          <option value="">Any category</option>
          {categories.map((c) => (
            <option key={c} value={c}>
              {categoryLabels[c]}
            </option>
          ))}
        </Select>
        <Select
          label="Waiting"
          value={String(query.olderThanDays ?? '')}
          onChange={(e) => onChange('olderThanDays', e.target.value)}
        >
          <option value="">Any time</option>
          <option value="1">More than a day</option>
          <option value="3">More than 3 days</option>
          <option value="7">More than a week</option>
          <option value="14">More than two weeks</option>
        </Select>
        <Select label="Author" value={query.authorTrust ?? ''} onChange={(e) => onChange('authorTrust', e.target.value)}>
          <option value="">Any author</option>
          {trustLevels.map((t) => (
            <option key={t} value={t}>
              {trustLevelLabels[t]}
            </option>
          ))}
        </Select>
        <Select label="Checks" value={query.checks ?? ''} onChange={(e) => onChange('checks', e.target.value)}>
          <option value="">Any outcome</option>
          {checkOutcomes.map((c) => (
            <option key={c} value={c}>
              {checkOutcomeLabels[c]}
            </option>
          ))}
        </Select>
      </div>
      {filtered && (
        <button type="button" className="mt-3 text-sm font-bold text-ink underline" onClick={onClear}>
          Clear the filters
        </button>
      )}
    </div>
  );
}
