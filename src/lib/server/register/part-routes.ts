import { z } from 'zod';
import { PART_KINDS, PART_STATUSES, type PartKind } from '../../register/kinds';
import { partCreateSchema, partUpdateSchema } from '../../register/schemas';
import { requireMember, requirePermission } from '../guard';
import { handle, HttpError, json, parseWith, readJson } from '../http';
import { pageOfList, readListQuery } from '../list-query';
import { createPart, deletePart, getPart, listParts, updatePart } from './parts';

/**
 * The endpoints of /api/parts and of /api/gear-sets, which is the same resource seen through the
 * gear-set kind: one implementation, two mounts.
 */
const filterSchema = z.object({
  kind: z.enum(PART_KINDS, { error: `kind: one of ${PART_KINDS.join(', ')}.` }).optional(),
  status: z.enum(PART_STATUSES, { error: `status: one of ${PART_STATUSES.join(', ')}.` }).optional(),
});

export function partCollectionRoutes(onlyKind?: PartKind) {
  return {
    GET: handle(async ({ locals, url }) => {
      const { team } = requireMember(locals);
      const filter = parseWith(filterSchema, {
        kind: url.searchParams.get('kind') ?? undefined,
        status: url.searchParams.get('status') ?? undefined,
      });
      const kind = onlyKind ?? filter.kind;
      const items = (await listParts(team.id, kind)).filter((p) => !filter.status || p.status === filter.status);
      return json(pageOfList(items, readListQuery(url)));
    }),
    POST: handle(async ({ locals, request }) => {
      const access = requirePermission(locals, 'parts:edit');
      const schema = onlyKind ? partCreateSchema.transform((body) => ({ ...body, kind: onlyKind })) : partCreateSchema;
      const raw = await readJson(request, z.unknown());
      const body = parseWith(schema, onlyKind && raw && typeof raw === 'object' ? { ...raw, kind: onlyKind } : raw);
      return json(await createPart(access, body), 201);
    }),
  };
}

export function partItemRoutes(onlyKind?: PartKind) {
  const requireKind = async (teamId: string, id: string) => {
    const part = await getPart(teamId, id);
    if (onlyKind && part.kind !== onlyKind) throw new HttpError(404, 'No such gear set in this team.');
    return part;
  };
  return {
    GET: handle(async ({ locals, params }) => {
      const { team } = requireMember(locals);
      return json(await requireKind(team.id, params.id ?? ''));
    }),
    PATCH: handle(async ({ locals, params, request }) => {
      const access = requirePermission(locals, 'parts:edit');
      const changes = await readJson(request, partUpdateSchema);
      await requireKind(access.team.id, params.id ?? '');
      return json(await updatePart(access, params.id ?? '', changes));
    }),
    DELETE: handle(async ({ locals, params }) => {
      const access = requirePermission(locals, 'parts:edit');
      await requireKind(access.team.id, params.id ?? '');
      await deletePart(access, params.id ?? '');
      return new Response(null, { status: 204 });
    }),
  };
}
