import { partCollectionRoutes } from '../../../lib/server/register/part-routes';

/** The parts register seen through the gear-set kind. */
export const { GET, POST } = partCollectionRoutes('gear-set');
