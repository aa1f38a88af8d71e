import { useState, type ReactElement } from 'react';
import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import type { PartView } from '../../lib/register/views';
import AddPartForm from './AddPartForm';
import { fetchTeamSettings, SETTINGS_KEY, type TeamSettingsAnswer } from './team-settings-query';

interface Props {
  /** The settings request the island started when the form was opened. */
  settings: Promise<TeamSettingsAnswer>;
  onCreated: (part: PartView) => void;
  onCancel: () => void;
}

// Here rather than in the island, so TanStack Query loads with the form and not with the page.
function createSettingsClient(early: Promise<TeamSettingsAnswer>): QueryClient {
  const client = new QueryClient({ defaultOptions: { queries: { staleTime: 60_000, retry: 2 } } });
  let pending: Promise<TeamSettingsAnswer> | null = early;
  // The first attempt is the request already under way; a retry asks again.
  const firstThenFetch = () => {
    const answer = pending ?? fetchTeamSettings();
    pending = null;
    return answer;
  };
  // The form shows a failure itself (its useQuery reads the same query).
  client.query({ queryKey: SETTINGS_KEY, queryFn: firstThenFetch }).catch(() => undefined);
  return client;
}

/** The add-part form with the query client it reads the team's defaults through. */
export default function AddPartPanel({ settings, onCreated, onCancel }: Props): ReactElement {
  const [client] = useState(() => createSettingsClient(settings));
  return (
    <QueryClientProvider client={client}>
      <AddPartForm onCreated={onCreated} onCancel={onCancel} />
    </QueryClientProvider>
  );
}
