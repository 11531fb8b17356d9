import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { FormControl, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialogModule } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSelectModule } from '@angular/material/select';
import { type Observable, firstValueFrom } from 'rxjs';
import type { ContractorView } from '../../../shared/api/work-orders';
import { ContractorApi, type ContractorPerson } from './contractor-api';
import { errorMessage } from './messages';

/**
 * The people of a contractor company: contractor users of the organization who see and
 * work its jobs. Each change is saved at once; the list reloads when the dialog closes.
 */
@Component({
  selector: 'cw-contractor-members-dialog',
  imports: [MatButtonModule, MatDialogModule, MatFormFieldModule, MatIconModule, MatProgressBarModule, MatSelectModule, ReactiveFormsModule],
  templateUrl: './contractor-members-dialog.html',
  styleUrls: ['./dialog.scss', './contractor-members-dialog.scss'],
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ContractorMembersDialog {
  private readonly api = inject(ContractorApi);

  protected readonly contractor = signal(inject<ContractorView>(MAT_DIALOG_DATA));
  protected readonly people = signal<ContractorPerson[] | null>(null);
  protected readonly busy = signal(false);
  protected readonly error = signal<string | null>(null);
  protected readonly candidate = new FormControl<string | null>(null);
  /** Contractor users not yet in this company. */
  protected readonly candidates = computed(() => {
    const members = new Set(this.contractor().members.map((member) => member.userId));
    return (this.people() ?? []).filter((person) => !members.has(person.userId));
  });

  constructor() {
    this.api
      .people()
      .pipe(takeUntilDestroyed())
      .subscribe({ next: (people) => this.people.set(people), error: (error: unknown) => (this.people.set([]), this.error.set(errorMessage(error))) });
  }

  protected async add(): Promise<void> {
    const userId = this.candidate.value;
    if (!userId) return;
    if (await this.act(this.api.addMember(this.contractor().id, userId))) this.candidate.reset();
  }

  protected remove(member: ContractorPerson): Promise<boolean> {
    return this.act(this.api.removeMember(this.contractor().id, member.userId));
  }

  private async act(call: Observable<ContractorView>): Promise<boolean> {
    if (this.busy()) return false;
    this.busy.set(true);
    this.error.set(null);
    try {
      this.contractor.set(await firstValueFrom(call));
      return true;
    } catch (error) {
      this.error.set(errorMessage(error));
      return false;
    } finally {
      this.busy.set(false);
    }
  }
}
