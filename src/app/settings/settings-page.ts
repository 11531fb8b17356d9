import { ChangeDetectionStrategy, Component } from '@angular/core';
import { DetectionSettingsForm } from './detection-settings-form';
import { EmailPreferences } from './email-preferences';
import { ResponseSettingsForm } from './response-settings-form';

/** Settings: detection per appliance style, the organization's response targets, one's own e-mail. */
@Component({
  selector: 'cw-settings-page',
  imports: [DetectionSettingsForm, EmailPreferences, ResponseSettingsForm],
  template: `
    <div class="cw-page">
      <h1 class="cw-page-title">Settings</h1>
      <p class="cw-page-lead">How early the monitor speaks up, how fast repairs are expected, and what reaches your inbox.</p>
      <cw-detection-settings-form />
      <cw-response-settings-form />
      <cw-email-preferences />
    </div>
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SettingsPage {}
