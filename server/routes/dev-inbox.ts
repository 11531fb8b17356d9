import { z } from 'zod';
import { RouteGroup } from '../auth/route-table';
import type { devInboxController } from '../controllers/dev-inbox';
import { validate } from '../middleware/validate';

const MessageParams = z.object({ messageId: z.string().regex(/^\d{13}-[0-9a-f]{8}$/, 'not a message id') });

/**
 * The fake mail server's inbox. Public on purpose — an invitee has no account yet — and
 * mounted only while mail stays on this machine and the server listens on loopback.
 */
export function devInboxRoutes(controller: ReturnType<typeof devInboxController>): RouteGroup[] {
  const rule = (summary: string) => ({ access: 'public' as const, scope: 'none' as const, summary: `dev inbox: ${summary}` });
  const params = validate({ params: MessageParams });
  const api = new RouteGroup('/api/dev/inbox')
    .get('/', rule('messages, newest first'), controller.list)
    .get('/:messageId', rule('one message with its links'), params, controller.get)
    .get('/:messageId/raw', rule('the .eml file'), params, controller.raw);
  const pages = new RouteGroup('/dev/inbox')
    .get('/', rule('page listing messages'), controller.listPage)
    .get('/:messageId', rule('page of one message'), params, controller.messagePage)
    .get('/:messageId/html', rule("the message's HTML, sandboxed"), params, controller.htmlBody);
  return [api, pages];
}

