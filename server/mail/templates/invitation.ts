import type { Role } from '../../../shared/domain';
import { compose, formatExpiry, PRODUCT_NAME, type MailContent } from './layout';

export interface InvitationMail {
  displayName: string;
  inviterName: string;
  organizationName: string;
  role: Role;
  unitLabel: string | null;
  propertyName: string | null;
  url: string;
  expiresAt: Date;
}

function whatYouCanDo(mail: InvitationMail): string {
  if (mail.role === 'tenant') {
    const where = mail.unitLabel ? `unit ${mail.unitLabel}${mail.propertyName ? ` at ${mail.propertyName}` : ''}` : 'your unit';
    return `With ${PRODUCT_NAME} you can see how the refrigerator in ${where} is doing, get food-safety advice when it warms up, and report a problem to your property manager.`;
  }
  if (mail.role === 'contractor') {
    return `With ${PRODUCT_NAME} you receive the work orders ${mail.organizationName} dispatches to you, with the probable failed part and the unit's temperature history.`;
  }
  return `With ${PRODUCT_NAME} you watch over the refrigerators and freezers of ${mail.organizationName} and act before food is at risk.`;
}

export function invitationMail(mail: InvitationMail): MailContent {
  return compose({
    subject: `${mail.inviterName} invited you to ${PRODUCT_NAME}`,
    greeting: `Hello ${mail.displayName},`,
    paragraphs: [`${mail.inviterName} of ${mail.organizationName} invited you to ${PRODUCT_NAME} as a ${mail.role}.`, whatYouCanDo(mail)],
    action: { label: 'Accept the invitation and choose a password', url: mail.url },
    notes: [
      `The link works once and expires on ${formatExpiry(mail.expiresAt, null)}.`,
      'If you did not expect this invitation, you can ignore this message.',
    ],
  });
}
