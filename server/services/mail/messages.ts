import type { ServerConfig } from '../../config';
import type { PublicUser } from '../../models';
import type { MailMessage } from './mailer';
import { htmlLines, markup } from './html';
import { PRODUCT, linkMail } from './layout';
import {
  assignmentUrl,
  classInviteUrl,
  forgotPasswordUrl,
  passwordResetUrl,
  signInUrl,
  signupConfirmUrl,
} from '../links';

/** The password-reset mail: a single-use link valid for `validMinutes`. */
export function passwordResetMail(
  config: ServerConfig,
  to: { email: string; name: string },
  token: string,
  validMinutes: number,
): MailMessage {
  const asked = `Someone (we hope you) asked to reset the password of your ${PRODUCT} account.`;
  return linkMail({
    to: to.email,
    subject: `${PRODUCT}: reset your password`,
    name: to.name,
    intro: [
      {
        text: `${asked}\nOpen this link within ${validMinutes} minutes to choose a new one. It works once.`,
        html: markup`${asked} Open the link within ${validMinutes} minutes to choose a new one. It works once.`,
      },
    ],
    link: { label: 'Choose a new password', url: passwordResetUrl(config, token) },
    footer: 'If you did not ask for this, ignore this mail: your password stays as it is.',
  });
}

/** The last step of a sign-up: the link that creates the account, valid for `validHours`. */
export function signupConfirmMail(
  config: ServerConfig,
  to: { email: string; name: string },
  token: string,
  validHours: number,
): MailMessage {
  const create = `within ${validHours} hours to create your ${PRODUCT} account, then sign in with the`;
  return linkMail({
    to: to.email,
    subject: `${PRODUCT}: confirm your address to finish signing up`,
    name: to.name,
    intro: [
      {
        text: `Open this link ${create}\npassword you chose.`,
        html: markup`Open the link ${create} password you chose.`,
      },
    ],
    link: { label: 'Create my account', url: signupConfirmUrl(config, token) },
    footer: 'If you did not ask for an account, ignore this mail: without the link, none is made.',
  });
}

/** To the owner of an address someone tried to sign up with: it has an account already. */
export function signupAttemptMail(config: ServerConfig, to: { email: string; name: string }): MailMessage {
  const signIn = signInUrl(config);
  const forgot = forgotPasswordUrl(config);
  const askForNew = markup`<a href="${forgot}">ask for a new one</a>`;
  const tried = `Someone tried to create a ${PRODUCT} account with this address, which already has one.`;
  return linkMail({
    to: to.email,
    subject: `${PRODUCT}: someone tried to sign up with your address`,
    name: to.name,
    intro: [
      {
        text: [
          tried,
          `If it was you, sign in at ${signIn}`,
          `or, if you have forgotten your password, ask for a new one at ${forgot}`,
        ].join('\n'),
        html: markup`${tried} If it was you, sign in; if you have forgotten your password, ${askForNew}.`,
      },
    ],
    link: { label: 'Sign in', url: signIn },
    linkLineInText: false,
    footer: 'If it was not you, nothing has changed: your account and password stay as they are.',
  });
}

/** "A sketch was shared with you": the read-only link the owner chose to send. */
export function shareNoticeMail(
  config: ServerConfig,
  args: { to: string; from: PublicUser; sketchName: string; url: string },
): MailMessage {
  const footer =
    `You get this mail because ${args.from.name} entered your address in ${PRODUCT}. ` +
    'The link opens the sketch read-only; sign in to copy it into your own library.';
  return linkMail({
    to: args.to,
    subject: `${args.from.name} shared the sketch "${args.sketchName}" with you`,
    intro: [
      {
        text: `${args.from.name} shared the ${PRODUCT} sketch "${args.sketchName}" with you.`,
        html: markup`${args.from.name} shared the ${PRODUCT} sketch <strong>${args.sketchName}</strong> with you.`,
      },
    ],
    link: { label: 'Open the sketch', url: args.url },
    // The text body names the site too: it has no layout that says where the mail is from.
    footer: { text: `${footer}\n(${config.publicUrl})`, html: markup`${footer}` },
  });
}

/** An invitation to join a class: a single-use link that works until `expiresAt`. */
export function classInviteMail(
  config: ServerConfig,
  args: { to: string; instructor: string; className: string; token: string; expiresAt: Date },
): MailMessage {
  const until = args.expiresAt.toISOString().slice(0, 10);
  return linkMail({
    to: args.to,
    subject: `${args.instructor} invites you to the class "${args.className}"`,
    intro: [
      {
        text: `${args.instructor} invites you to join the class "${args.className}" in ${PRODUCT}.\nOpen this link to join:`,
        html: markup`${args.instructor} invites you to join the class <strong>${args.className}</strong> in ${PRODUCT}.`,
      },
    ],
    link: { label: 'Join the class', url: classInviteUrl(config, args.token) },
    footer:
      `You get this mail because ${args.instructor} entered your address in ${PRODUCT}. ` +
      `The link works once, until ${until}. Sign in or make an account after opening it; ignore this mail to decline.`,
  });
}

/** Feedback on a hand-in, written by the instructor, with a link to the assignment's page. */
export function feedbackMail(
  config: ServerConfig,
  args: { to: { email: string; name: string }; instructor: string; assignmentId: number; title: string; text: string },
): MailMessage {
  return linkMail({
    to: args.to.email,
    subject: `Feedback on "${args.title}" from ${args.instructor}`,
    name: args.to.name,
    intro: [
      {
        text: `${args.instructor} wrote feedback on your hand-in for "${args.title}":`,
        html: markup`${args.instructor} wrote feedback on your hand-in for <strong>${args.title}</strong>:`,
      },
      { text: args.text, html: htmlLines(args.text) },
    ],
    link: { label: 'Open the assignment', url: assignmentUrl(config, args.assignmentId) },
    footer: `You get this mail because you handed in work for "${args.title}" in ${PRODUCT}.`,
  });
}
