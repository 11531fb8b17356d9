import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { MatTableModule } from '@angular/material/table';
import { RouterLink } from '@angular/router';
import type { ApplianceSpend, PropertySpend } from '../../../shared/api/reports';
import { formatMoney } from '../appliance/money';
import { STYLE_LABELS } from '../fleet/appliance-words';

const MONEY_COLUMNS = ['total', 'approved', 'pending', 'other', 'parts', 'labour', 'workOrders'];

/** Spend per property or per appliance: parts + labour, approved and pending apart. */
@Component({
  selector: 'cw-spend-table',
  imports: [MatTableModule, RouterLink],
  templateUrl: './spend-table.html',
  styleUrl: './report-table.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SpendTable {
  readonly rows = input.required<readonly (PropertySpend | ApplianceSpend)[]>();
  readonly per = input.required<'property' | 'appliance'>();
  readonly label = input.required<string>();

  protected readonly styleLabels = STYLE_LABELS;
  protected readonly columns = computed(() => (this.per() === 'property' ? ['property', ...MONEY_COLUMNS] : ['appliance', 'property', ...MONEY_COLUMNS]));
  protected readonly money = formatMoney;

  protected applianceOf(row: PropertySpend | ApplianceSpend): ApplianceSpend {
    return row as ApplianceSpend;
  }
}
