import { attachmentItemRoutes } from '@/lib/catalogue/attachment-routes';

export const dynamic = 'force-dynamic';

const routes = attachmentItemRoutes('part');
export const GET = routes.GET;
export const DELETE = routes.DELETE;
