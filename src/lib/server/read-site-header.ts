import type { AstroCookies } from 'astro';
import { issueCsrfToken } from './csrf';
import { listTeamsOf } from './teams';

/** What the site header shows beyond the session: the person's teams (for the switch) and the sign-out token. */
export interface SiteHeaderView {
  teams: { id: string; name: string }[];
  csrfToken: string;
}

/**
 * The site header in one query (the person's teams) and no query when nobody is signed in. The layout
 * calls it and hands the header its props.
 */
export async function readSiteHeader(
  locals: App.Locals,
  request: Request,
  cookies: AstroCookies,
): Promise<SiteHeaderView> {
  if (!locals.user) return { teams: [], csrfToken: '' };
  const [teams, csrfToken] = await Promise.all([listTeamsOf(locals.user.id), issueCsrfToken(request, cookies)]);
  return { teams: teams.map((t) => ({ id: t.id, name: t.name })), csrfToken };
}
