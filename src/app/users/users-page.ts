import { DatePipe } from '@angular/common';
import { AfterViewInit, ChangeDetectionStrategy, Component, DestroyRef, inject, signal, viewChild } from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { FormControl, FormGroup, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatChipsModule } from '@angular/material/chips';
import { MatDialog, MatDialogModule } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatMenuModule } from '@angular/material/menu';
import { MatPaginator, MatPaginatorModule } from '@angular/material/paginator';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSelectModule } from '@angular/material/select';
import { MatSnackBar, MatSnackBarModule } from '@angular/material/snack-bar';
import { MatSort, MatSortModule } from '@angular/material/sort';
import { MatTableModule } from '@angular/material/table';
import { Subject, catchError, debounceTime, firstValueFrom, map, merge, of, startWith, switchMap, tap } from 'rxjs';
import type { InvitationSummary, UserQueryInput, UserStatus, UserSummary } from '../../../shared/api/users';
import { USER_SORTS } from '../../../shared/api/users';
import type { Role } from '../../../shared/domain';
import { messageOf } from '../auth/password-validators';
import { Session } from '../core/auth/session';
import { ChangeRoleDialog } from './change-role-dialog';
import { InviteDialog } from './invite-dialog';
import { ROLE_LABELS, unitLabel } from './role-fields';
import { UsersApi } from './users-api';

export const PAGE_SIZE = 25;

type SortKey = (typeof USER_SORTS)[number];

/**
 * An administrator's people page: the organization's users, server-paged, filtered and
 * sorted; invitations; role changes; deactivation with undo.
 */
@Component({
  selector: 'cw-users-page',
  imports: [
    DatePipe,
    MatButtonModule,
    MatChipsModule,
    MatDialogModule,
    MatFormFieldModule,
    MatIconModule,
    MatInputModule,
    MatMenuModule,
    MatPaginatorModule,
    MatProgressBarModule,
    MatSelectModule,
    MatSnackBarModule,
    MatSortModule,
    MatTableModule,
    ReactiveFormsModule,
  ],
  templateUrl: './users-page.html',
  styleUrl: './users-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class UsersPage implements AfterViewInit {
  private readonly api = inject(UsersApi);
  private readonly dialog = inject(MatDialog);
  private readonly snackBar = inject(MatSnackBar);
  private readonly destroyRef = inject(DestroyRef);
  protected readonly session = inject(Session);

  readonly sort = viewChild.required(MatSort);
  readonly paginator = viewChild.required(MatPaginator);

  protected readonly columns = ['displayName', 'email', 'role', 'unit', 'status', 'actions'];
  protected readonly invitationColumns = ['email', 'role', 'unit', 'status', 'expiresAt', 'actions'];
  protected readonly unitLabel = unitLabel;
  protected readonly pageSize = PAGE_SIZE;

  protected readonly filters = new FormGroup({
    q: new FormControl('', { nonNullable: true }),
    role: new FormControl<Role | ''>('', { nonNullable: true }),
    status: new FormControl<UserStatus>('active', { nonNullable: true }),
  });
  protected readonly users = signal<UserSummary[]>([]);
  protected readonly total = signal(0);
  protected readonly loading = signal(true);
  protected readonly error = signal<string | null>(null);
  protected readonly invitations = signal<InvitationSummary[]>([]);
  private readonly reload = new Subject<void>();

  ngAfterViewInit(): void {
    const sort = this.sort();
    const paginator = this.paginator();
    const filterChanges = this.filters.valueChanges.pipe(debounceTime(300));
    // Sorting or filtering starts again from the first page.
    merge(sort.sortChange, filterChanges).pipe(takeUntilDestroyed(this.destroyRef)).subscribe(() => (paginator.pageIndex = 0));
    merge(sort.sortChange, paginator.page, filterChanges, this.reload)
      .pipe(
        startWith(null),
        tap(() => this.loading.set(true)),
        map(() => this.query(sort, paginator)),
        switchMap((query) =>
          this.api.list(query).pipe(
            map((page) => ({ page, error: null as string | null })),
            catchError((error: unknown) => of({ page: null, error: messageOf(error) })),
          ),
        ),
        takeUntilDestroyed(this.destroyRef),
      )
      .subscribe(({ page, error }) => {
        this.loading.set(false);
        this.error.set(error);
        if (page) {
          this.users.set(page.items);
          this.total.set(page.total);
        }
      });
    this.loadInvitations();
  }

  protected roleLabel(role: Role): string {
    return ROLE_LABELS[role];
  }

  protected isSelf(user: UserSummary): boolean {
    return user.id === this.session.user()?.id;
  }

  protected invite(): void {
    this.dialog
      .open<InviteDialog, void, InvitationSummary>(InviteDialog, { autoFocus: 'first-tabbable' })
      .afterClosed()
      .subscribe((invitation) => {
        if (!invitation) return;
        this.snackBar.open(`Invitation sent to ${invitation.email}.`, 'OK', { duration: 5000 });
        this.loadInvitations();
      });
  }

  protected changeRole(user: UserSummary): void {
    this.dialog
      .open<ChangeRoleDialog, UserSummary, UserSummary>(ChangeRoleDialog, { data: user })
      .afterClosed()
      .subscribe((changed) => {
        if (!changed) return;
        this.snackBar.open(`${changed.displayName} is now a ${ROLE_LABELS[changed.role].toLowerCase()}${changed.isAdmin ? ' and administrator' : ''}.`, 'OK', { duration: 5000 });
        this.reload.next();
      });
  }

  protected async deactivate(user: UserSummary): Promise<void> {
    if (!(await this.act(() => this.api.deactivate(user.id)))) return;
    const undo = this.snackBar.open(`${user.displayName} is deactivated and signed out.`, 'Undo', { duration: 8000 });
    undo.onAction().subscribe(() => void this.reactivate(user));
  }

  protected async reactivate(user: UserSummary): Promise<void> {
    if (await this.act(() => this.api.reactivate(user.id))) this.snackBar.open(`${user.displayName} can sign in again.`, 'OK', { duration: 5000 });
  }

  protected async withdraw(invitation: InvitationSummary): Promise<void> {
    try {
      await firstValueFrom(this.api.withdraw(invitation.id));
      this.snackBar.open(`The invitation to ${invitation.email} no longer works.`, 'OK', { duration: 5000 });
      this.loadInvitations();
    } catch (error) {
      this.snackBar.open(messageOf(error), 'OK', { duration: 8000 });
    }
  }

  private async act(call: () => ReturnType<UsersApi['deactivate']>): Promise<boolean> {
    try {
      await firstValueFrom(call());
      this.reload.next();
      return true;
    } catch (error) {
      this.snackBar.open(messageOf(error), 'OK', { duration: 8000 });
      return false;
    }
  }

  private loadInvitations(): void {
    this.api
      .invitations()
      .pipe(catchError(() => of([] as InvitationSummary[])), takeUntilDestroyed(this.destroyRef))
      .subscribe((rows) => this.invitations.set(rows.filter((row) => row.status === 'pending' || row.status === 'expired')));
  }

  private query(sort: MatSort, paginator: MatPaginator): UserQueryInput {
    const { q, role, status } = this.filters.getRawValue();
    const sortKey = (USER_SORTS as readonly string[]).includes(sort.active) ? (sort.active as SortKey) : 'displayName';
    return {
      q: q.trim() || undefined,
      role: role || undefined,
      status,
      sort: sortKey,
      direction: sort.direction === 'desc' ? 'desc' : 'asc',
      page: paginator.pageIndex,
      pageSize: paginator.pageSize,
    };
  }
}
