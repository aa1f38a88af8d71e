import type { APIRoute } from 'astro';
import { switchTeamSchema } from '../../lib/account-schemas';
import { readForm } from '../../lib/server/forms';
import { switchTeam } from '../../lib/server/teams';
import { HttpError } from '../../lib/server/http';

/** The header's team switcher posts here (an HTML form, so it works without JavaScript). */
export const POST: APIRoute = async ({ request, locals, redirect }) => {
  if (!locals.user) return redirect('/sign-in', 303);
  const result = await readForm(request, switchTeamSchema);
  if (!result.ok) return new Response('Choose a team.', { status: 400 });
  try {
    await switchTeam(locals.user.id, result.data.teamId);
  } catch (error) {
    if (error instanceof HttpError) return new Response(error.message, { status: error.status });
    throw error;
  }
  return redirect('/', 303);
};
