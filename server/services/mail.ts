import type { Role } from '../../shared/domain';
import type { Mailer } from '../mail/mailer';
import { emailChangedMail, invitationMail, passwordChangedMail, passwordResetMail, type MailContent } from '../mail/templates';

/**
 * The product's e-mails, addressed and linked to pages of this server. Link tokens go in
 * the URL fragment (after #): browsers never send it, so it stays out of server logs and
 * Referer headers.
 */
export class MailService {
  constructor(
    private readonly mailer: Mailer,
    private readonly publicUrl: string,
  ) {}

  pageUrl(page: string, token?: string): string {
    const url = new URL(page, this.publicUrl);
    if (token) url.hash = token;
    return url.toString();
  }

  private send(to: string, content: MailContent): Promise<void> {
    return this.mailer.send({ to, ...content });
  }

  sendInvitation(to: string, mail: { token: string; displayName: string; inviterName: string; organizationName: string; role: Role; unitLabel: string | null; propertyName: string | null; expiresAt: Date }): Promise<void> {
    const { token, ...rest } = mail;
    return this.send(to, invitationMail({ ...rest, url: this.pageUrl('/accept-invitation', token) }));
  }

  sendPasswordReset(to: string, mail: { token: string; displayName: string; expiresAt: Date; timeZone: string | null }): Promise<void> {
    const { token, ...rest } = mail;
    return this.send(to, passwordResetMail({ ...rest, url: this.pageUrl('/reset-password', token) }));
  }

  sendPasswordChanged(to: string, displayName: string): Promise<void> {
    return this.send(to, passwordChangedMail({ displayName, signInUrl: this.pageUrl('/sign-in'), forgotUrl: this.pageUrl('/forgot-password') }));
  }

  sendEmailChanged(oldAddress: string, displayName: string, newEmail: string): Promise<void> {
    return this.send(oldAddress, emailChangedMail({ displayName, newEmail, forgotUrl: this.pageUrl('/forgot-password') }));
  }
}
