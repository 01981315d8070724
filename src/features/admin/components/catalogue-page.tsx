import { Page } from '../../../components/ui/page';
import { Loading } from '../../../components/ui/query-state';
import { useCatalogueChanges } from '../api/catalogue';
import { ChassisDesk } from './chassis-desk';
import { PartsDesk } from './parts-desk';
import { formatDateTime } from '@shared/dates';

const actionWords = { edit: 'corrected', merge: 'merged', approve: 'approved' } as const;
// the record keeps field names; people read the form's words
const fieldWords: Record<string, string> = {
  make: 'make',
  model: 'model',
  code: 'chassis code',
  yearFrom: 'first year',
  yearTo: 'last year',
  body: 'body',
  lugCount: 'wheel bolts per hub',
  pcdMm: 'bolt circle (mm)',
  centreBoreMm: 'centre bore (mm)',
  wheelBoltThread: 'wheel-bolt thread',
  notes: 'notes',
  kind: 'kind',
  name: 'name',
  maker: 'maker',
  partNumbers: 'part numbers',
  cameOn: 'came on',
};

function RecentChanges() {
  const changes = useCatalogueChanges();
  return (
    <section aria-labelledby="catalogue-changes" className="space-y-3">
      <h2 id="catalogue-changes" className="text-xl font-extrabold text-ink">
        Recent changes
      </h2>
      {changes.isPending ? (
        <Loading />
      ) : changes.data?.length ? (
        <ol className="space-y-2 text-sm">
          {changes.data.map((c) => (
            <li key={c.id} className="rounded-md border border-graphite/10 bg-paper-card px-3 py-2">
              <span className="text-graphite-soft">{formatDateTime(c.at)}</span> ·{' '}
              <strong>{c.actor ? `@${c.actor.login}` : 'the shell'}</strong> {actionWords[c.action]} {c.subjectLabel}
              {c.action === 'edit' && (
                <>
                  : {c.field ? (fieldWords[c.field] ?? c.field) : ''}{' '}
                  <span className="text-graphite-soft">{c.from || '(empty)'}</span> → {c.to || '(empty)'}
                </>
              )}
              {c.action === 'merge' && <> (folded in: {c.from})</>}
            </li>
          ))}
        </ol>
      ) : (
        <p className="text-graphite-soft">No changes yet.</p>
      )}
    </section>
  );
}

/** The admins' catalogue desk. */
export default function CataloguePage() {
  return (
    <Page
      title="Catalogue"
      heading="Catalogue"
      lead="Correct chassis and parts, fold duplicates together, and publish chassis proposed with submissions. A proposed chassis stays private until it is approved here or its first swap is published. Every change is recorded with who made it."
    >
      <div className="grid gap-10 lg:grid-cols-2">
        <ChassisDesk />
        <PartsDesk />
      </div>
      <div className="mt-10">
        <RecentChanges />
      </div>
    </Page>
  );
}
