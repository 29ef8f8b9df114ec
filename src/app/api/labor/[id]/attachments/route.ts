import { attachmentCollectionRoutes } from '@/lib/http/attachment-routes';
import { getLabor } from '@/lib/db/queries/labor';

const routes = attachmentCollectionRoutes('labor', async (id) => (await getLabor(id)) !== null);
export const GET = routes.GET;
export const POST = routes.POST;
