import { attachmentItemRoutes } from '@/lib/http/attachment-routes';

const routes = attachmentItemRoutes('part');
export const GET = routes.GET;
export const DELETE = routes.DELETE;
