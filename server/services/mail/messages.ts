import type { ServerConfig } from '../../config';
import type { PublicUser } from '../../models';
import type { MailMessage } from './mailer';
import {
  assignmentUrl,
  classInviteUrl,
  forgotPasswordUrl,
  passwordResetUrl,
  signInUrl,
  signupConfirmUrl,
} from '../links';

/** The link drawn as a button; mail clients ignore style sheets, so the style is inline. */
const BUTTON_STYLE =
  'display:inline-block;padding:10px 16px;background:#2f5d8a;color:#fff;text-decoration:none;border-radius:4px';

const PRODUCT = 'Arcwright';

/** Header text on one line: a name typed by a user must not start a new header. */
function oneLine(s: string): string {
  return s.replace(/[\r\n\t]+/g, ' ').trim();
}

function escapeHtml(s: string): string {
  return s.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);
}

/** Wraps paragraphs (already escaped) and one button link in the product's plain mail layout. */
function layout(paragraphs: string[], link: { label: string; url: string }, footer: string): string {
  const url = escapeHtml(link.url);
  return [
    '<!doctype html><html><body style="font-family:Roboto,Arial,sans-serif;color:#1d2733;max-width:560px">',
    `<h2 style="color:#2f5d8a;margin-bottom:8px">${PRODUCT}</h2>`,
    ...paragraphs.map((p) => `<p>${p}</p>`),
    `<p><a href="${url}" style="${BUTTON_STYLE}">${escapeHtml(link.label)}</a></p>`,
    `<p style="font-size:13px;color:#5b6773">Or paste this address into your browser: ${url}</p>`,
    `<p style="font-size:12px;color:#5b6773">${footer}</p>`,
    '</body></html>',
  ].join('\n');
}

/** The password-reset mail: a single-use link valid for `validMinutes`. */
export function passwordResetMail(
  config: ServerConfig,
  to: { email: string; name: string },
  token: string,
  validMinutes: number,
): MailMessage {
  const url = passwordResetUrl(config, token);
  const footer = 'If you did not ask for this, ignore this mail: your password stays as it is.';
  return {
    to: to.email,
    subject: `${PRODUCT}: reset your password`,
    text: [
      `Hello ${to.name},`,
      '',
      `Someone (we hope you) asked to reset the password of your ${PRODUCT} account.`,
      `Open this link within ${validMinutes} minutes to choose a new one. It works once.`,
      '',
      url,
      '',
      footer,
    ].join('\n'),
    html: layout(
      [
        `Hello ${escapeHtml(to.name)},`,
        `Someone (we hope you) asked to reset the password of your ${PRODUCT} account. ` +
          `Open the link within ${validMinutes} minutes to choose a new one. It works once.`,
      ],
      { label: 'Choose a new password', url },
      footer,
    ),
  };
}

/** The last step of a sign-up: the link that creates the account, valid for `validHours`. */
export function signupConfirmMail(
  config: ServerConfig,
  to: { email: string; name: string },
  token: string,
  validHours: number,
): MailMessage {
  const url = signupConfirmUrl(config, token);
  const footer = 'If you did not ask for an account, ignore this mail: without the link, none is made.';
  return {
    to: to.email,
    subject: `${PRODUCT}: confirm your address to finish signing up`,
    text: [
      `Hello ${to.name},`,
      '',
      `Open this link within ${validHours} hours to create your ${PRODUCT} account, then sign in with the`,
      'password you chose.',
      '',
      url,
      '',
      footer,
    ].join('\n'),
    html: layout(
      [
        `Hello ${escapeHtml(to.name)},`,
        `Open the link within ${validHours} hours to create your ${PRODUCT} account, then sign in with the ` +
          'password you chose.',
      ],
      { label: 'Create my account', url },
      footer,
    ),
  };
}

/** To the owner of an address someone tried to sign up with: it has an account already. */
export function signupAttemptMail(config: ServerConfig, to: { email: string; name: string }): MailMessage {
  const signIn = signInUrl(config);
  const forgot = forgotPasswordUrl(config);
  const footer = 'If it was not you, nothing has changed: your account and password stay as they are.';
  return {
    to: to.email,
    subject: `${PRODUCT}: someone tried to sign up with your address`,
    text: [
      `Hello ${to.name},`,
      '',
      `Someone tried to create a ${PRODUCT} account with this address, which already has one.`,
      `If it was you, sign in at ${signIn}`,
      `or, if you have forgotten your password, ask for a new one at ${forgot}`,
      '',
      footer,
    ].join('\n'),
    html: layout(
      [
        `Hello ${escapeHtml(to.name)},`,
        `Someone tried to create a ${PRODUCT} account with this address, which already has one. ` +
          `If it was you, sign in; if you have forgotten your password, ` +
          `<a href="${escapeHtml(forgot)}">ask for a new one</a>.`,
      ],
      { label: 'Sign in', url: signIn },
      footer,
    ),
  };
}

/** "A sketch was shared with you": the read-only link the owner chose to send. */
export function shareNoticeMail(
  config: ServerConfig,
  args: { to: string; from: PublicUser; sketchName: string; url: string },
): MailMessage {
  const footer =
    `You get this mail because ${args.from.name} entered your address in ${PRODUCT}. ` +
    'The link opens the sketch read-only; sign in to copy it into your own library.';
  return {
    to: args.to,
    subject: oneLine(`${args.from.name} shared the sketch "${args.sketchName}" with you`),
    text: [
      'Hello,',
      '',
      `${args.from.name} shared the ${PRODUCT} sketch "${args.sketchName}" with you.`,
      '',
      args.url,
      '',
      footer,
      `(${config.publicUrl})`,
    ].join('\n'),
    html: layout(
      [
        `Hello,`,
        `${escapeHtml(args.from.name)} shared the ${PRODUCT} sketch <strong>${escapeHtml(args.sketchName)}</strong> with you.`,
      ],
      { label: 'Open the sketch', url: args.url },
      escapeHtml(footer),
    ),
  };
}

/** An invitation to join a class: a single-use link that works until `expiresAt`. */
export function classInviteMail(
  config: ServerConfig,
  args: { to: string; instructor: string; className: string; token: string; expiresAt: Date },
): MailMessage {
  const url = classInviteUrl(config, args.token);
  const until = args.expiresAt.toISOString().slice(0, 10);
  const footer =
    `You get this mail because ${args.instructor} entered your address in ${PRODUCT}. ` +
    `The link works once, until ${until}. Sign in or make an account after opening it; ignore this mail to decline.`;
  return {
    to: args.to,
    subject: oneLine(`${args.instructor} invites you to the class "${args.className}"`),
    text: [
      'Hello,',
      '',
      `${args.instructor} invites you to join the class "${args.className}" in ${PRODUCT}.`,
      'Open this link to join:',
      '',
      url,
      '',
      footer,
    ].join('\n'),
    html: layout(
      [
        'Hello,',
        `${escapeHtml(args.instructor)} invites you to join the class <strong>${escapeHtml(args.className)}</strong> ` +
          `in ${PRODUCT}.`,
      ],
      { label: 'Join the class', url },
      escapeHtml(footer),
    ),
  };
}

/** Feedback on a hand-in, written by the instructor, with a link to the assignment's page. */
export function feedbackMail(
  config: ServerConfig,
  args: { to: { email: string; name: string }; instructor: string; assignmentId: number; title: string; text: string },
): MailMessage {
  const url = assignmentUrl(config, args.assignmentId);
  const footer = `You get this mail because you handed in work for "${args.title}" in ${PRODUCT}.`;
  return {
    to: args.to.email,
    subject: oneLine(`Feedback on "${args.title}" from ${args.instructor}`),
    text: [
      `Hello ${args.to.name},`,
      '',
      `${args.instructor} wrote feedback on your hand-in for "${args.title}":`,
      '',
      args.text,
      '',
      url,
      '',
      footer,
    ].join('\n'),
    html: layout(
      [
        `Hello ${escapeHtml(args.to.name)},`,
        `${escapeHtml(args.instructor)} wrote feedback on your hand-in for <strong>${escapeHtml(args.title)}</strong>:`,
        escapeHtml(args.text).replace(/\r?\n/g, '<br>'),
      ],
      { label: 'Open the assignment', url },
      escapeHtml(footer),
    ),
  };
}
