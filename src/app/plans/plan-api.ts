import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { firstValueFrom } from 'rxjs';
import type { FormulaSummary } from '../formulas/formula-api-types';
import type {
  AssemblyOption,
  PlanList,
  PlanListItem,
  PlanRequest,
  PlanUnits,
  PlanWithStock,
  PresentedResult,
  RawBatchOptions,
  RecordedPlan,
} from './plan-types';

/**
 * The plans API: the assemblies that can be planned, the plans made (GET /api/plans), a plan
 * (POST /api/plans), recording its
 * batches as planned (POST /api/plans/record) and its production sheets as a PDF
 * (POST /api/plans/sheet.pdf). Requests go through the app's HttpClient, so every POST carries
 * the session's CSRF token (core/api/api-error-interceptor.ts) and fails as an ApiError.
 */
@Injectable({ providedIn: 'root' })
export class PlanApi {
  private readonly http = inject(HttpClient);

  /** The assemblies of the library by title (GET /api/formulas, filtered here to assemblies). */
  async assemblies(): Promise<AssemblyOption[]> {
    const { formulas } = await firstValueFrom(
      this.http.get<{ formulas: readonly FormulaSummary[] }>('/api/formulas'),
    );
    const options: AssemblyOption[] = [];
    for (const item of formulas) {
      if (item.kind !== 'assembly' || item.id === null || item.duplicate) continue;
      options.push({ id: item.id, title: item.title ?? item.id, valid: item.valid });
    }
    return options.sort((a, b) => a.title.localeCompare(b.title));
  }

  /** Works out a plan, with its pull list against the lots on hand; records nothing. */
  plan(request: PlanRequest): Promise<PlanWithStock> {
    return firstValueFrom(this.http.post<PlanWithStock>('/api/plans', request));
  }

  /**
   * Records every batch of the plan as planned (admins and cooks), all or none. Refused with 409
   * 'plan-already-recorded' when its menu item and day already have batches, unless `again`.
   */
  record(request: PlanRequest, again = false): Promise<RecordedPlan> {
    const body = again ? { ...request, again } : request;
    return firstValueFrom(this.http.post<RecordedPlan>('/api/plans/record', body));
  }

  /** The plans made, newest first, recorded or not (GET /api/plans). */
  async list(): Promise<readonly PlanListItem[]> {
    const { plans } = await firstValueFrom(this.http.get<PlanList>('/api/plans'));
    return plans;
  }

  /**
   * One batch of a plan worked out again with more options (a dough's room and flour
   * temperatures): POST /api/calc, which records nothing.
   */
  calc(formula: string, batch: RawBatchOptions, units: PlanUnits): Promise<PresentedResult> {
    return firstValueFrom(this.http.post<PresentedResult>('/api/calc', { formula, batch, units }));
  }

  /** The plan's production sheets, one a day, as a PDF. */
  sheetPdf(request: PlanRequest): Promise<Blob> {
    return firstValueFrom(
      this.http.post('/api/plans/sheet.pdf', request, {
        responseType: 'blob',
        headers: { Accept: 'application/pdf' },
      }),
    );
  }
}
