import { attachmentCollectionRoutes } from '@/lib/http/attachment-routes';
import { getCam } from '@/lib/db/queries/cams';

const routes = attachmentCollectionRoutes('cam', async (id) => (await getCam(id)) !== null);
export const GET = routes.GET;
export const POST = routes.POST;
