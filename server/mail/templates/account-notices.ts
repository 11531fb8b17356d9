import { compose, PRODUCT_NAME, type MailContent } from './layout';

/** Sent after a password changed, so the owner notices a change they did not make. */
export function passwordChangedMail(mail: { displayName: string; signInUrl: string; forgotUrl: string }): MailContent {
  return compose({
    subject: `Your ${PRODUCT_NAME} password was changed`,
    greeting: `Hello ${mail.displayName},`,
    paragraphs: [`The password of your ${PRODUCT_NAME} account was just changed, and every other session was signed out.`],
    action: { label: 'Sign in', url: mail.signInUrl },
    notes: [`If you did not change it, reset your password now: ${mail.forgotUrl}`],
  });
}

/** Sent to the OLD address after an e-mail change. */
export function emailChangedMail(mail: { displayName: string; newEmail: string; forgotUrl: string }): MailContent {
  return compose({
    subject: `Your ${PRODUCT_NAME} e-mail address was changed`,
    greeting: `Hello ${mail.displayName},`,
    paragraphs: [`Your ${PRODUCT_NAME} account now signs in with ${mail.newEmail}. Messages will go to that address from now on.`],
    notes: [`If you did not make this change, tell your property manager at once, and reset your password: ${mail.forgotUrl}`],
  });
}
