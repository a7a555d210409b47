import { roleLabels, type MemberRole } from '../../features/auth/schema';
import { escapeHtml } from './escapeHtml';

export interface InvitationMailFacts {
  shopName: string;
  inviterName: string;
  role: MemberRole;
  link: string;
  expiresAt: Date;
}

/** The invitation e-mail in plain text and HTML; the shop and inviter names are user-supplied, so the HTML escapes them. */
export function invitationMail(facts: InvitationMailFacts): { subject: string; text: string; html: string } {
  const role = roleLabels[facts.role].toLowerCase();
  const until = facts.expiresAt.toUTCString();
  const subject = `${facts.inviterName} invited you to ${facts.shopName} on Matwright`;
  const text = [
    `${facts.inviterName} invited you to join ${facts.shopName} on Matwright as ${role}.`,
    '',
    'Open this link to choose your name and password:',
    facts.link,
    '',
    `The link works once and until ${until}.`,
    'If you did not expect this, you can ignore this message.',
  ].join('\n');
  const e = escapeHtml;
  const html = [
    `<p>${e(facts.inviterName)} invited you to join <strong>${e(facts.shopName)}</strong> on Matwright as ${e(role)}.</p>`,
    `<p><a href="${e(facts.link)}">Join ${e(facts.shopName)}</a></p>`,
    `<p>Or paste this link into your browser: ${e(facts.link)}</p>`,
    `<p>The link works once and until ${e(until)}. If you did not expect this, you can ignore this message.</p>`,
  ].join('\n');
  return { subject, text, html };
}
