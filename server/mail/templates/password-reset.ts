import { compose, formatExpiry, PRODUCT_NAME, type MailContent } from './layout';

export interface PasswordResetMail {
  displayName: string;
  url: string;
  expiresAt: Date;
  timeZone: string | null;
}

export function passwordResetMail(mail: PasswordResetMail): MailContent {
  return compose({
    subject: `Reset your ${PRODUCT_NAME} password`,
    greeting: `Hello ${mail.displayName},`,
    paragraphs: [`Someone asked to reset the password of your ${PRODUCT_NAME} account. If it was you, choose a new password with the link below.`],
    action: { label: 'Choose a new password', url: mail.url },
    notes: [
      `The link works once and expires on ${formatExpiry(mail.expiresAt, mail.timeZone)}.`,
      'If you did not ask for this, ignore this message: your password stays as it is.',
    ],
  });
}
