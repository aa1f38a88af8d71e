import { partItemRoutes } from '../../../lib/server/register/part-routes';

export const { GET, PATCH, DELETE } = partItemRoutes('gear-set');
