import type { OutgoingMail } from './mail-service';

export interface MailContent {
  to: string;
  subject: string;
  greeting: string;
  /** Paragraphs before the link. */
  body: string[];
  action: { label: string; url: string };
  /** Paragraphs after the link: how long it works, what to do if unexpected. */
  after: string[];
}

const escapeHtml = (text: string): string =>
  text
    .replace(/&/g, '&amp;')
    .replace(/</g, '&lt;')
    .replace(/>/g, '&gt;')
    .replace(/"/g, '&quot;')
    .replace(/'/g, '&#39;');

const SIGNATURE = 'Bindery, the shared record of your multi-receiver setups';

/** The same message as plain text and as simple HTML, each with the link written out. */
export function composeMail(content: MailContent): OutgoingMail {
  const text = [
    content.greeting,
    '',
    ...content.body.flatMap((p) => [p, '']),
    `${content.action.label}:`,
    content.action.url,
    '',
    ...content.after.flatMap((p) => [p, '']),
    '-- ',
    SIGNATURE,
    '',
  ].join('\n');
  const paragraph = (p: string) => `<p style="margin:0 0 14px">${escapeHtml(p)}</p>`;
  const url = escapeHtml(content.action.url);
  const html = [
    '<!doctype html>',
    `<html><head><meta charset="utf-8"><title>${escapeHtml(content.subject)}</title></head>`,
    '<body style="margin:0;padding:24px;background:#f5f0e6;color:#1c2230;font-family:Helvetica,Arial,sans-serif;font-size:15px;line-height:1.5">',
    '<div style="max-width:560px;margin:0 auto;background:#fffcf5;border:1px solid #e0d3bb;border-radius:8px;padding:24px">',
    paragraph(content.greeting),
    ...content.body.map(paragraph),
    `<p style="margin:20px 0"><a href="${url}" style="display:inline-block;background:#1d4a73;color:#ffffff;text-decoration:none;padding:10px 16px;border-radius:6px;font-weight:bold">${escapeHtml(content.action.label)}</a></p>`,
    `<p style="margin:0 0 14px;font-size:13px;color:#3a4252">Or open this address: <a href="${url}" style="color:#1d4a73">${url}</a></p>`,
    ...content.after.map(paragraph),
    `<p style="margin:20px 0 0;font-size:13px;color:#5b6372">${escapeHtml(SIGNATURE)}</p>`,
    '</div></body></html>',
  ].join('\n');
  return { to: content.to, subject: content.subject, text, html };
}

/** A date as a mail shows it, without guessing the reader's time zone. */
export const mailDate = (date: Date): string => `${date.toISOString().slice(0, 16).replace('T', ' ')} UTC`;
