import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type { Observable } from 'rxjs';
import type { ContractorView, CoverageView, CreateContractorRequest, SetCoverageRequest, UpdateContractorRequest } from '../../../shared/api/work-orders';

export type ContractorPerson = ContractorView['members'][number];

/** `/api/contractors` and `/api/coverage`: the repair companies and who covers which property and style. */
@Injectable({ providedIn: 'root' })
export class ContractorApi {
  private readonly http = inject(HttpClient);
  private readonly base = '/api/contractors';

  list(): Observable<ContractorView[]> {
    return this.http.get<ContractorView[]>(this.base);
  }

  create(input: CreateContractorRequest): Observable<ContractorView> {
    return this.http.post<ContractorView>(this.base, input);
  }

  change(contractorId: string, change: UpdateContractorRequest): Observable<ContractorView> {
    return this.http.patch<ContractorView>(`${this.base}/${contractorId}`, change);
  }

  /** The organization's contractor users, who can be made members of a company. */
  people(): Observable<ContractorPerson[]> {
    return this.http.get<ContractorPerson[]>(`${this.base}/people`);
  }

  addMember(contractorId: string, userId: string): Observable<ContractorView> {
    return this.http.post<ContractorView>(`${this.base}/${contractorId}/members`, { userId });
  }

  removeMember(contractorId: string, userId: string): Observable<ContractorView> {
    return this.http.delete<ContractorView>(`${this.base}/${contractorId}/members/${userId}`);
  }

  coverage(): Observable<CoverageView[]> {
    return this.http.get<CoverageView[]>('/api/coverage');
  }

  /** Fills or (contractorId null) clears one slot; answers with that property's rows. */
  setCoverage(slot: SetCoverageRequest): Observable<CoverageView[]> {
    return this.http.put<CoverageView[]>('/api/coverage', slot);
  }
}
