// Where mail goes, read from the environment. With SMTP_HOST set, Bindery sends through
// that server (production); without it, through a local mail server of its own that
// keeps every message in the outbox table (development and the demo).

export interface SmtpSettings {
  mode: 'smtp';
  host: string;
  port: number;
  /** TLS from the first byte (port 465); otherwise STARTTLS when the server offers it. */
  secure: boolean;
  user: string | null;
  password: string | null;
  from: string;
  appUrl: string;
}

export interface LocalSettings {
  mode: 'local';
  /** null takes a free port */
  port: number | null;
  from: string;
  appUrl: string;
}

export type MailSettings = SmtpSettings | LocalSettings;

export const DEFAULT_FROM = 'Bindery <bindery@localhost>';

function port(value: string | undefined, name: string): number | null {
  if (value === undefined || value === '') return null;
  const parsed = Number(value);
  if (!Number.isInteger(parsed) || parsed <= 0 || parsed > 65535)
    throw new Error(`${name} must be a port number, got "${value}"`);
  return parsed;
}

function appUrlFrom(value: string | undefined, fallback: string): string {
  const raw = value && value.length > 0 ? value : fallback;
  let url: URL;
  try {
    url = new URL(raw);
  } catch {
    throw new Error(`APP_URL must be an absolute http(s) address, got "${raw}"`);
  }
  if (url.protocol !== 'http:' && url.protocol !== 'https:')
    throw new Error(`APP_URL must be an http(s) address, got "${raw}"`);
  return url.toString().replace(/\/+$/, '');
}

/** `fallbackAppUrl` is where this process serves the app, for links when APP_URL is not set. */
export function mailSettingsFromEnv(env: NodeJS.ProcessEnv, fallbackAppUrl: string): MailSettings {
  const from = env.MAIL_FROM && env.MAIL_FROM.trim() !== '' ? env.MAIL_FROM.trim() : DEFAULT_FROM;
  const appUrl = appUrlFrom(env.APP_URL, fallbackAppUrl);
  const host = env.SMTP_HOST?.trim();
  if (!host) return { mode: 'local', port: port(env.MAIL_PORT, 'MAIL_PORT'), from, appUrl };
  const smtpPort = port(env.SMTP_PORT, 'SMTP_PORT') ?? 587;
  const secure =
    env.SMTP_SECURE === undefined || env.SMTP_SECURE === ''
      ? smtpPort === 465
      : ['true', '1'].includes(env.SMTP_SECURE);
  return {
    mode: 'smtp',
    host,
    port: smtpPort,
    secure,
    user: env.SMTP_USER || null,
    password: env.SMTP_PASSWORD || null,
    from,
    appUrl,
  };
}
