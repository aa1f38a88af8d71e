import { z } from 'zod';
import { TORQUE_UNITS } from '../../../../../../lib/units';
import { requireMember } from '../../../../../../lib/server/guard';
import { handle, parseWith } from '../../../../../../lib/server/http';
import { drawStepDiagram } from '../../../../../../lib/server/procedures/diagrams';

const query = z.object({
  version: z.coerce.number({ error: 'version: a version number.' }).int().min(1, 'version: 1 or more.').optional(),
  unit: z.enum(TORQUE_UNITS as ['N-m', 'lbf-in', 'lbf-ft'], { error: 'unit: lbf-ft, lbf-in or N-m.' }).optional(),
});

/** The step's tightening diagram as SVG (any member); passes in `?unit=` or the reader's unit. */
export const GET = handle(async ({ locals, params, url }) => {
  const access = requireMember(locals);
  const { version, unit } = parseWith(query, {
    version: url.searchParams.get('version') ?? undefined,
    unit: url.searchParams.get('unit') ?? undefined,
  });
  const svg = await drawStepDiagram(access.team.id, params.id ?? '', params.stepId ?? '', {
    version,
    unit: unit ?? access.user.torqueUnit,
  });
  return new Response(svg, {
    status: 200,
    headers: { 'Content-Type': 'image/svg+xml; charset=utf-8', 'Cache-Control': 'private, no-cache' },
  });
});
