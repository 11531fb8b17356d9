import { ChangeDetectionStrategy, Component, DestroyRef, type OnInit, inject, signal } from '@angular/core';
import { takeUntilDestroyed, toSignal } from '@angular/core/rxjs-interop';
import { type AbstractControl, ControlContainer, ReactiveFormsModule } from '@angular/forms';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatSelectModule } from '@angular/material/select';
import { catchError, of, startWith } from 'rxjs';
import type { Role } from '../../../shared/domain';
import { ROLE_CHOICES, unitLabel } from './role-fields';
import { UsersApi } from './users-api';

/**
 * The role, unit (a tenant's) and administrator (a manager's) fields of a user dialog. It
 * sits inside the dialog's `<form [formGroup]>` and binds to that group's `role`, `unitId`
 * and `isAdmin` controls; the dialog checks that a tenant has a unit when it submits.
 */
@Component({
  selector: 'cw-role-field-group',
  imports: [MatCheckboxModule, MatFormFieldModule, MatSelectModule, ReactiveFormsModule],
  templateUrl: './role-field-group.html',
  styleUrl: './role-field-group.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
  // formControlName inside this component finds the dialog's form group.
  viewProviders: [{ provide: ControlContainer, useFactory: () => inject(ControlContainer, { skipSelf: true }) }],
})
export class RoleFieldGroup implements OnInit {
  private readonly container = inject(ControlContainer, { skipSelf: true });
  private readonly destroyRef = inject(DestroyRef);

  protected readonly roles = ROLE_CHOICES;
  protected readonly unitLabel = unitLabel;
  protected readonly units = toSignal(inject(UsersApi).unitOptions().pipe(catchError(() => of([]))), { initialValue: [] });
  protected readonly role = signal<Role | null>(null);

  ngOnInit(): void {
    // The group is the parent directive's input, set before this component's first check.
    const role = this.container.control?.get('role') as AbstractControl<Role> | null;
    if (!role) throw new Error('cw-role-field-group needs a form group with a role control');
    role.valueChanges.pipe(startWith(role.value), takeUntilDestroyed(this.destroyRef)).subscribe((value) => this.role.set(value));
  }
}
