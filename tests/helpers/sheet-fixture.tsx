import { vi } from 'vitest';
import { render } from '@testing-library/react';
import InspectionSheet from '../../src/components/inspections/InspectionSheet';
import type { SheetProps } from '../../src/components/inspections/sheet-context';
import { DEFAULT_PROFILE, DEFAULT_PROFILE_SOURCES } from '../../src/lib/analysis/tolerance';

/**
 * The whole sheet in jsdom against a fake API that answers like the real endpoints: the gear set,
 * its profile (the published defaults), the run count, and create / patch of the draft.
 */
export const GEAR_SET = {
  id: 'gs1',
  serial: 'GS-4101',
  ringTeeth: 40,
  pinionTeeth: 9,
  ratioLabel: '4.44:1',
  pressureAngleDeg: 20,
  totalRuns: 44,
  runsSinceInstall: 12,
  location: { targetType: 'assembly', targetId: 'a1', label: 'assembly RE-01' },
};

export const PROPS: SheetProps = {
  mode: 'new',
  user: { id: 'u1', name: 'Ines Calloway', lengthUnit: 'in', torqueUnit: 'lbf-in' },
  role: 'technician',
  canEditAny: false,
  gearSets: [{ id: 'gs1', serial: 'GS-4101', ratioLabel: '4.44:1', status: 'in-service' }],
  assemblies: [{ id: 'a1', serial: 'RE-01', name: 'Ember rear end' }],
  members: [{ id: 'u1', name: 'Ines Calloway' }],
  positionsDefault: 4,
};

export interface FakeCall {
  method: string;
  path: string;
  headers: Record<string, string>;
  body: unknown;
}

/** Installs a fetch that answers like the API; `online: false` makes every call fail as offline does. */
export function installFakeApi(options: { online?: boolean } = {}) {
  const calls: FakeCall[] = [];
  const state: { online: boolean; createAnswer?: { status: number; body: unknown } } = {
    online: options.online ?? true,
  };
  const json = (status: number, body: unknown) =>
    new Response(JSON.stringify(body), { status, headers: { 'Content-Type': 'application/json' } });
  const fetchMock = vi.fn(async (input: string | URL | Request, init?: RequestInit) => {
    const path = String(input);
    const method = init?.method ?? 'GET';
    const headers = Object.fromEntries(Object.entries((init?.headers as Record<string, string>) ?? {}));
    const body = typeof init?.body === 'string' ? JSON.parse(init.body) : undefined;
    calls.push({ method, path, headers, body });
    if (!state.online) throw new TypeError('Failed to fetch');
    if (path.startsWith('/api/gear-sets/gs1/run-count')) return json(200, { totalRuns: 44, runsSinceInstall: 12 });
    if (path === '/api/gear-sets/gs1') return json(200, GEAR_SET);
    if (path === '/api/tolerance-profiles/for-gear-set/gs1') {
      const { sources: _s, ...values } = DEFAULT_PROFILE;
      return json(200, {
        profileId: 'p1',
        versionId: 'v1',
        version: 1,
        name: 'Team default',
        values,
        sources: DEFAULT_PROFILE_SOURCES,
      });
    }
    if (path === '/api/inspections' && method === 'POST' && state.createAnswer)
      return json(state.createAnswer.status, state.createAnswer.body);
    if (path === '/api/inspections' && method === 'POST')
      return json(201, { id: 'i1', status: 'draft', createdBy: 'u1', revision: 1, ...(body as object) });
    if (path === '/api/inspections/i1' && method === 'PATCH')
      return json(200, { id: 'i1', status: 'draft', createdBy: 'u1', revision: 2, ...(body as object) });
    if (path === '/api/inspections/i1/submit')
      return json(200, { id: 'i1', status: 'submitted', createdBy: 'u1', revision: 2 });
    if (path === '/api/inspections/i1/photos') return json(200, { items: [] });
    return json(404, { error: { message: `no fake for ${method} ${path}` } });
  });
  vi.stubGlobal('fetch', fetchMock);
  return { calls, state, fetchMock };
}

/** Opens the sheet at `search` (e.g. ?gearSetId=gs1). */
export function renderSheet(search = '?gearSetId=gs1', props: SheetProps = PROPS) {
  window.history.replaceState(null, '', `/inspections/new${search}`);
  return render(<InspectionSheet {...props} />);
}
