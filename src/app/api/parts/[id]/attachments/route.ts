import { attachmentCollectionRoutes } from '@/lib/http/attachment-routes';
import { getPart } from '@/lib/db/queries/parts';

const routes = attachmentCollectionRoutes('part', async (id) => (await getPart(id)) !== null);
export const GET = routes.GET;
export const POST = routes.POST;
