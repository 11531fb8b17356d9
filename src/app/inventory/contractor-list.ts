import { BreakpointObserver } from '@angular/cdk/layout';
import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { takeUntilDestroyed, toSignal } from '@angular/core/rxjs-interop';
import { FormControl, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatMenuModule } from '@angular/material/menu';
import { MatSelectModule } from '@angular/material/select';
import { MatSnackBar } from '@angular/material/snack-bar';
import { MatTableModule } from '@angular/material/table';
import { RouterLink } from '@angular/router';
import { Subject, catchError, firstValueFrom, map, of, startWith, switchMap, tap } from 'rxjs';
import type { ArchiveFilter } from '../../../shared/api/inventory';
import type { ContractorView } from '../../../shared/api/work-orders';
import { EmptyState } from '../shared/empty-state/empty-state';
import { ContractorApi } from './contractor-api';
import { ContractorDialog } from './contractor-dialog';
import { ContractorMembersDialog } from './contractor-members-dialog';
import { ListStatus } from './list-status';
import { errorMessage } from './messages';

/** The organization's contractor companies with their contact and people; add, edit, archive. */
@Component({
  selector: 'cw-contractor-list',
  imports: [EmptyState, ListStatus, MatButtonModule, MatFormFieldModule, MatIconModule, MatMenuModule, MatSelectModule, MatTableModule, ReactiveFormsModule, RouterLink],
  templateUrl: './contractor-list.html',
  styleUrls: ['./list.scss', './contractor-list.scss'],
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ContractorList {
  private readonly api = inject(ContractorApi);
  private readonly dialog = inject(MatDialog);
  private readonly snackBar = inject(MatSnackBar);
  private readonly narrow = toSignal(inject(BreakpointObserver).observe('(max-width: 719px)').pipe(map((state) => state.matches)), { initialValue: false });
  private readonly reloads = new Subject<void>();

  protected readonly contractors = signal<ContractorView[]>([]);
  protected readonly loading = signal(true);
  protected readonly loaded = signal(false);
  protected readonly error = signal<string | null>(null);
  protected readonly status = new FormControl<ArchiveFilter>('active', { nonNullable: true });
  private readonly statusValue = toSignal(this.status.valueChanges, { initialValue: this.status.value });
  protected readonly rows = computed(() => {
    const status = this.statusValue();
    return this.contractors().filter((c) => status === 'all' || (status === 'archived') === (c.archivedAt !== null));
  });
  protected readonly columns = computed(() => (this.narrow() ? ['name', 'actions'] : ['name', 'contact', 'members', 'actions']));
  protected readonly nothingYet = computed(() => this.loaded() && this.contractors().length === 0);
  protected readonly isNarrow = this.narrow;

  constructor() {
    this.reloads
      .pipe(
        startWith(undefined),
        tap(() => this.loading.set(true)),
        switchMap(() => this.api.list().pipe(catchError((error: unknown) => of(errorMessage(error))))),
        takeUntilDestroyed(),
      )
      .subscribe((answer) => {
        this.loading.set(false);
        if (typeof answer === 'string') return this.error.set(answer);
        this.error.set(null);
        this.contractors.set(answer);
        this.loaded.set(true);
      });
  }

  protected memberNames(contractor: ContractorView): string {
    return contractor.members.length ? contractor.members.map((member) => member.displayName).join(', ') : 'nobody yet';
  }

  protected add(): void {
    this.openDialog(null);
  }

  protected edit(contractor: ContractorView): void {
    this.openDialog(contractor);
  }

  protected members(contractor: ContractorView): void {
    this.dialog
      .open(ContractorMembersDialog, { data: contractor, autoFocus: 'first-tabbable', maxWidth: '95vw' })
      .afterClosed()
      .subscribe(() => this.reloads.next());
  }

  protected async archive(contractor: ContractorView): Promise<void> {
    if (!(await this.setArchived(contractor, true))) return;
    const undo = this.snackBar.open(`${contractor.name} is archived: no new work order goes to it.`, 'Undo', { duration: 8000 });
    undo.onAction().subscribe(() => void this.restore(contractor));
  }

  protected async restore(contractor: ContractorView): Promise<void> {
    if (await this.setArchived(contractor, false)) this.snackBar.open(`${contractor.name} is back in the list.`, 'OK', { duration: 5000 });
  }

  private openDialog(contractor: ContractorView | null): void {
    this.dialog
      .open<ContractorDialog, ContractorView | null, ContractorView>(ContractorDialog, { data: contractor, autoFocus: 'first-tabbable', maxWidth: '95vw' })
      .afterClosed()
      .subscribe((saved) => {
        if (!saved) return;
        this.snackBar.open(contractor ? `${saved.name} is saved.` : `${saved.name} is added. Give it coverage so work orders reach it.`, 'OK', { duration: 5000 });
        this.reloads.next();
      });
  }

  private async setArchived(contractor: ContractorView, archived: boolean): Promise<boolean> {
    try {
      await firstValueFrom(this.api.change(contractor.id, { archived }));
      this.reloads.next();
      return true;
    } catch (error) {
      this.snackBar.open(errorMessage(error), 'OK', { duration: 8000 });
      return false;
    }
  }
}
