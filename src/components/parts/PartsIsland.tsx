import { lazy, Suspense, useState } from 'react';
import { QueryClient, QueryClientProvider, useQuery, useQueryClient } from '@tanstack/react-query';
import type { PartView } from '../../lib/server/register/parts';
import type { PlaceLookup } from '../../lib/register/place';
import { PART_KIND_LABELS } from '../../lib/register/kinds';
import { getJson, type Page } from '../shared/api';
import { PartsTable } from './PartsTable';
import { fetchTeamSettings, PARTS_KEY, PARTS_PATH, SETTINGS_KEY } from './parts-queries';

// The form (react-hook-form, zod and the shared schema) loads only when someone opens it.
const AddPartForm = lazy(() => import('./AddPartForm'));

export interface PartsIslandProps {
  /** The first page, rendered by the server so the table shows before any request. */
  initialPage: Page<PartView>;
  /** When the server read `initialPage` (ms), so the first fetch waits until it is stale. */
  renderedAt: number;
  lookup: PlaceLookup;
  dueWithin: number;
  canAdd: boolean;
}

/** The parts page's island: one QueryClient for the list and the add form. */
export default function PartsIsland(props: PartsIslandProps) {
  const [client] = useState(() => new QueryClient({ defaultOptions: { queries: { staleTime: 60_000, retry: 2 } } }));
  return (
    <QueryClientProvider client={client}>
      <PartsScreen {...props} />
    </QueryClientProvider>
  );
}

function PartsScreen({ initialPage, renderedAt, lookup, dueWithin, canAdd }: PartsIslandProps) {
  const queryClient = useQueryClient();
  const parts = useQuery({
    queryKey: PARTS_KEY,
    queryFn: () => getJson<Page<PartView>>(PARTS_PATH),
    initialData: initialPage,
    initialDataUpdatedAt: renderedAt,
  });
  const [adding, setAdding] = useState(false);
  const [added, setAdded] = useState<PartView | null>(null);
  const page = parts.data;

  const openForm = () => {
    setAdding(true);
    setAdded(null);
    // Ask for the team's defaults while the form's code arrives; the form shows any failure itself.
    queryClient.query({ queryKey: SETTINGS_KEY, queryFn: fetchTeamSettings }).catch(() => undefined);
  };

  return (
    <div>
      <div className="mb-4 flex flex-wrap items-center gap-3">
        <button type="button" className="btn btn-quiet" onClick={() => void parts.refetch()} disabled={parts.isFetching}>
          {parts.isFetching ? 'Refreshing…' : 'Refresh'}
        </button>
        {canAdd && !adding && (
          <button type="button" className="btn" onClick={openForm}>
            Add a part
          </button>
        )}
        {parts.isError && (
          <p className="notice notice-error" role="alert">
            Could not refresh: {parts.error.message}
          </p>
        )}
      </div>

      {added && (
        <p className="notice mb-4" role="status">
          Added {PART_KIND_LABELS[added.kind].toLowerCase()} <a href={`/parts/${encodeURIComponent(added.id)}`}>{added.serial}</a>. It is on the shelf as a spare.
        </p>
      )}

      {canAdd && adding && (
        <section aria-labelledby="add-part-heading" className="card mb-6">
          <h2 id="add-part-heading" className="mb-3">Add a part</h2>
          <Suspense fallback={<p role="status">Loading the form…</p>}>
            <AddPartForm
              onCancel={() => setAdding(false)}
              onCreated={(part) => {
                setAdded(part);
                setAdding(false);
                void queryClient.invalidateQueries({ queryKey: PARTS_KEY });
              }}
            />
          </Suspense>
        </section>
      )}

      <PartsTable parts={page.items} lookup={lookup} dueWithin={dueWithin} />
      {page.nextCursor && <p className="mt-2 text-ink-soft">The register holds more than {page.items.length} parts; the table shows the first {page.items.length}.</p>}
    </div>
  );
}
