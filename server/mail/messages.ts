// Wording of the e-mails the product sends.
import escapeHtml from 'escape-html';
import type { Role } from '../../shared/schema/api.ts';
import type { MailMessage } from './mailer.ts';

export function invitationMessage(p: { to: string; buildingName: string; inviterName: string; role: Role }): MailMessage {
  const text =
    `${p.inviterName} has added you as ${p.role} on the building "${p.buildingName}" in Stanchion.\n\n` +
    `Register with this e-mail address (${p.to}) and the building will appear in your list.\n`;
  const html =
    `<p>${escapeHtml(p.inviterName)} has added you as <b>${p.role}</b> on the building ` +
    `<b>${escapeHtml(p.buildingName)}</b> in Stanchion.</p>` +
    `<p>Register with this e-mail address (${escapeHtml(p.to)}) and the building will appear in your list.</p>`;
  return { to: p.to, subject: `Invitation to "${p.buildingName}" in Stanchion`, text, html };
}
