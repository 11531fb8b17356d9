import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { MatCardModule } from '@angular/material/card';
import { MatIconModule } from '@angular/material/icon';
import type { ServiceHistoryEntry } from '../../../shared/api/appliances';
import { CAUSES } from '../../../shared/causes';
import { ZonedDatePipe } from '../fleet/zoned-date';
import { formatMoney } from './money';

/** The work orders on this appliance: who came, what they found, what it cost. */
@Component({
  selector: 'cw-service-history',
  imports: [MatCardModule, MatIconModule, ZonedDatePipe],
  templateUrl: './service-history.html',
  styleUrl: './service-history.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ServiceHistory {
  readonly entries = input<ServiceHistoryEntry[] | null>(null);
  readonly timeZone = input<string | null>(null);

  protected readonly money = formatMoney;
  protected readonly total = computed(() => {
    const entries = this.entries() ?? [];
    return entries.length ? formatMoney(entries.reduce((sum, e) => sum + e.totalCents, 0), entries[0]!.currency) : null;
  });

  protected causeWords(entry: ServiceHistoryEntry): string {
    if (!entry.causeFound) return 'cause not recorded yet';
    return entry.causeFound === 'other' ? 'other cause' : CAUSES[entry.causeFound].title;
  }

  protected labourWords(minutes: number): string {
    const hours = Math.floor(minutes / 60);
    const rest = minutes % 60;
    return hours ? `${hours} h ${rest} min` : `${rest} min`;
  }
}
