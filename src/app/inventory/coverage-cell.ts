import { ChangeDetectionStrategy, Component, input, output } from '@angular/core';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatSelectModule, type MatSelect, type MatSelectChange } from '@angular/material/select';
import type { CoverageRank } from '../../../shared/api/work-orders';

export interface ContractorOption {
  id: string;
  name: string;
  archived: boolean;
}

export interface SlotPick {
  rank: CoverageRank;
  contractorId: string | null;
  /** The select that changed, so a refused save can put its value back. */
  select: MatSelect;
}

/** One cell of the coverage grid: who is dispatched first and who as backup for a property and style. */
@Component({
  selector: 'cw-coverage-cell',
  imports: [MatFormFieldModule, MatSelectModule],
  templateUrl: './coverage-cell.html',
  styleUrl: './coverage-cell.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CoverageCell {
  /** "Linden Court 1, top freezer": what the two selects are for, for screen readers. */
  readonly place = input.required<string>();
  /** Identifies the cell in the page, e.g. for tests: "propertyId|style". */
  readonly slotKey = input.required<string>();
  readonly options = input.required<ContractorOption[]>();
  readonly primaryId = input<string | null>(null);
  readonly backupId = input<string | null>(null);
  /** The property-wide row's contractor, dispatched when this style has none of its own. */
  readonly primaryFallback = input<string | null>(null);
  readonly backupFallback = input<string | null>(null);
  readonly saving = input(false);
  readonly error = input<string | null>(null);
  readonly picked = output<SlotPick>();

  protected readonly ranks: readonly CoverageRank[] = ['primary', 'backup'];

  protected current(rank: CoverageRank): string | null {
    return rank === 'primary' ? this.primaryId() : this.backupId();
  }

  protected other(rank: CoverageRank): string | null {
    return rank === 'primary' ? this.backupId() : this.primaryId();
  }

  protected fallback(rank: CoverageRank): string | null {
    return rank === 'primary' ? this.primaryFallback() : this.backupFallback();
  }

  protected pick(rank: CoverageRank, event: MatSelectChange): void {
    this.picked.emit({ rank, contractorId: (event.value as string | null | undefined) ?? null, select: event.source });
  }
}
