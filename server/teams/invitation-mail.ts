import { ROLE_DUTIES, ROLE_LABELS, type Role } from '../../shared/roles';
import type { OutgoingMail } from '../mail/mailer';

interface InvitationMailInput {
  to: string;
  teamId: string;
  teamName: string;
  siteName: string | null;
  inviterName: string;
  role: Role;
  link: string;
  expiresAt: Date;
}

function escapeHtml(text: string): string {
  return text.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);
}

export function invitationMail(m: InvitationMailInput): OutgoingMail {
  const team = m.siteName ? `${m.teamName} (${m.siteName})` : m.teamName;
  const expires = `${m.expiresAt.toISOString().slice(0, 16).replace('T', ' ')} UTC`;
  const text = [
    `${m.inviterName} invited you to join ${team} on Arcbench as ${ROLE_LABELS[m.role]}.`,
    `${ROLE_LABELS[m.role]}: ${ROLE_DUTIES[m.role]}`,
    '',
    `Accept the invitation: ${m.link}`,
    '',
    `The link works once and expires on ${expires}. If you did not expect this message, ignore it; nothing happens until the link is used.`,
  ].join('\n');
  const html = [
    `<p>${escapeHtml(m.inviterName)} invited you to join <strong>${escapeHtml(team)}</strong> on Arcbench as ${escapeHtml(ROLE_LABELS[m.role])}.</p>`,
    `<p>${escapeHtml(ROLE_LABELS[m.role])}: ${escapeHtml(ROLE_DUTIES[m.role])}</p>`,
    `<p><a href="${escapeHtml(m.link)}">Accept the invitation</a></p>`,
    `<p>The link works once and expires on ${escapeHtml(expires)}. If you did not expect this message, ignore it; nothing happens until the link is used.</p>`,
  ].join('\n');
  return { to: m.to, subject: `Invitation to join ${m.teamName} on Arcbench`, text, html, teamId: m.teamId, kind: 'invitation' };
}
