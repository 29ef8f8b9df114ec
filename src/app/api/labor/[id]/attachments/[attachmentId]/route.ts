import { attachmentItemRoutes } from '@/lib/http/attachment-routes';

export const dynamic = 'force-dynamic';

const routes = attachmentItemRoutes('labor');
export const GET = routes.GET;
export const DELETE = routes.DELETE;
