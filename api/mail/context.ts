import type { AppContext } from '../context';
import { ServiceUnavailable } from '../errors';
import type { MailService } from './mail-service';

declare module '../context' {
  interface AppContext {
    /** How mail goes out; absent, routes that must send mail answer 503. */
    mail?: MailService;
  }
}

export function mailFor(context: AppContext): MailService {
  if (!context.mail) {
    throw new ServiceUnavailable('This server has no mail set up, so it cannot send the e-mail this needs.', {
      code: 'mail-not-configured',
    });
  }
  return context.mail;
}

/** An absolute link into the app for a mail: `path` starts with a slash. */
export const appLink = (mail: MailService, path: string): string => `${mail.appUrl}${path}`;
