import { partCollectionRoutes } from '../../../lib/server/register/part-routes';

export const { GET, POST } = partCollectionRoutes();
