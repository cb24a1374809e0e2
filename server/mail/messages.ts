// Wording of the e-mails the product sends. Text people type (building and person names) is quoted as
// theirs, flattened to one line and kept short, and never makes up a subject: a name written like a
// phishing message stays a quoted name inside our own sentence (docs/access.md).
import escapeHtml from 'escape-html';
import type { Role } from '../../shared/schema/api.ts';
import type { MailMessage } from './mailer.ts';

/** User-chosen text as a quotation: control characters and line breaks removed, at most 80 characters. */
export function quoted(text: string): string {
  // Cc: the C0 and C1 control characters (U+0000–U+001F, U+007F–U+009F)
  const flat = text
    .replace(/[\p{Cc}\u2028\u2029]+/gu, ' ')
    .replace(/\s+/g, ' ')
    .trim();
  const short = flat.length > 80 ? `${flat.slice(0, 79)}…` : flat;
  return `“${short}”`;
}

export function invitationMessage(p: {
  to: string;
  buildingName: string;
  inviterName: string;
  role: Role;
  link: string;
  days: number;
}): MailMessage {
  const text =
    `You have been invited to a building in Stanchion as ${p.role}.\n\n` +
    `Building name, as its lead wrote it: ${quoted(p.buildingName)}\n` +
    `Invited by the account named: ${quoted(p.inviterName)}\n\n` +
    `To take up the invitation, sign in or register with this e-mail address (${p.to}) at ${p.link} and ` +
    `verify the address with the link we send you. The invitation ends after ${p.days} days.\n` +
    `If you did not expect this, ignore this message: nothing happens unless you verify the address.\n`;
  const html =
    `<p>You have been invited to a building in Stanchion as <b>${p.role}</b>.</p>` +
    `<p>Building name, as its lead wrote it: ${escapeHtml(quoted(p.buildingName))}<br>` +
    `Invited by the account named: ${escapeHtml(quoted(p.inviterName))}</p>` +
    `<p>To take up the invitation, sign in or register with this e-mail address (${escapeHtml(p.to)}) at ` +
    `<a href="${escapeHtml(p.link)}">${escapeHtml(p.link)}</a> and verify the address with the link we send you. ` +
    `The invitation ends after ${p.days} days.</p>` +
    `<p>If you did not expect this, ignore this message: nothing happens unless you verify the address.</p>`;
  return { to: p.to, subject: 'You have been invited to a building in Stanchion', text, html };
}

export function verificationMessage(p: { to: string; link: string }): MailMessage {
  const text =
    `Someone (we hope you) registered this address (${p.to}) with Stanchion.\n\n` +
    `To confirm it is yours, open this link within 48 hours:\n${p.link}\n\n` +
    `Until then you can sign in, but invitations to buildings wait for the confirmed address.\n` +
    `If you did not register, ignore this message.\n`;
  const html =
    `<p>Someone (we hope you) registered this address (${escapeHtml(p.to)}) with Stanchion.</p>` +
    `<p>To confirm it is yours, <a href="${escapeHtml(p.link)}">open this link</a> within 48 hours.</p>` +
    `<p>Until then you can sign in, but invitations to buildings wait for the confirmed address.</p>` +
    `<p>If you did not register, ignore this message.</p>`;
  return { to: p.to, subject: 'Confirm your e-mail address for Stanchion', text, html };
}

/** Sent instead of a verification link when the address already has an account. */
export function accountExistsMessage(p: { to: string; signInLink: string }): MailMessage {
  const text =
    `Someone tried to register this address (${p.to}) with Stanchion, but it already has an account.\n\n` +
    `If it was you, sign in instead: ${p.signInLink}\n` +
    `If it was not you, nothing has changed and you can ignore this message.\n`;
  const html =
    `<p>Someone tried to register this address (${escapeHtml(p.to)}) with Stanchion, but it already has an account.</p>` +
    `<p>If it was you, <a href="${escapeHtml(p.signInLink)}">sign in</a> instead. ` +
    `If it was not you, nothing has changed and you can ignore this message.</p>`;
  return { to: p.to, subject: 'Your Stanchion account', text, html };
}
