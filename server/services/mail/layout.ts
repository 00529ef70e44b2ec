import type { MailMessage } from './mailer';
import { Html, escapeHtml, markup } from './html';

export const PRODUCT = 'Arcwright';

/** The link drawn as a button; mail clients ignore style sheets, so the style is inline. */
const BUTTON_STYLE =
  'display:inline-block;padding:10px 16px;background:#2f5d8a;color:#fff;text-decoration:none;border-radius:4px';

/**
 * A paragraph of a mail: plain text, the same in both bodies (escaped in the HTML one), or its own wording in
 * each, where the HTML one sets names in bold or holds a link of its own.
 */
export type Paragraph = string | { text: string; html: Html };

export interface LinkMail {
  to: string;
  subject: string;
  /** Whom the greeting names; without it the mail opens with "Hello,". */
  name?: string;
  /** What the mail is about, after the greeting. */
  intro: Paragraph[];
  /** The one link the mail is for: its own line in the text body, a button in the HTML one. */
  link: { label: string; url: string };
  /** False where the text body's paragraphs name the link's address already, so no line repeats it. */
  linkLineInText?: boolean;
  /** Why the reader gets this mail, under the link. */
  footer: Paragraph;
}

const textOf = (p: Paragraph) => (typeof p === 'string' ? p : p.text);
const htmlOf = (p: Paragraph) => (typeof p === 'string' ? markup`${p}` : p.html);

/** Header text on one line: a name typed by a user must not start a new header. */
function oneLine(s: string): string {
  return s.replace(/[\r\n\t]+/g, ' ').trim();
}

/**
 * The product's mail of a greeting, a few paragraphs, one link and a footer, in plain text (paragraphs apart
 * by a blank line) and in HTML (the product's plain layout, the link as a button with its address beneath).
 */
export function linkMail(mail: LinkMail): MailMessage {
  const greeting = mail.name === undefined ? 'Hello,' : `Hello ${mail.name},`;
  const text = [greeting, ...mail.intro.map(textOf)];
  if (mail.linkLineInText !== false) text.push(mail.link.url);
  text.push(textOf(mail.footer));
  return {
    to: mail.to,
    subject: oneLine(mail.subject),
    text: text.join('\n\n'),
    html: layout([markup`${greeting}`, ...mail.intro.map(htmlOf)], mail.link, htmlOf(mail.footer)),
  };
}

function layout(paragraphs: Html[], link: { label: string; url: string }, footer: Html): string {
  const url = escapeHtml(link.url);
  return [
    '<!doctype html><html><body style="font-family:Roboto,Arial,sans-serif;color:#1d2733;max-width:560px">',
    `<h2 style="color:#2f5d8a;margin-bottom:8px">${PRODUCT}</h2>`,
    ...paragraphs.map((p) => `<p>${p.value}</p>`),
    `<p><a href="${url}" style="${BUTTON_STYLE}">${escapeHtml(link.label)}</a></p>`,
    `<p style="font-size:13px;color:#5b6773">Or paste this address into your browser: ${url}</p>`,
    `<p style="font-size:12px;color:#5b6773">${footer.value}</p>`,
    '</body></html>',
  ].join('\n');
}
