import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { firstValueFrom } from 'rxjs';
import type {
  BatchCostRecord,
  BlendTrims,
  FormulaCosts,
  LeastCostAnswer,
} from '../../../shared/api/cost-record.ts';

export type {
  BatchCostRecord,
  BlendTrimRecord,
  FormulaCostPoint,
  FormulaCosts,
  LeastCostAnswer,
} from '../../../shared/api/cost-record.ts';

/** The standards a least-cost blend can be made under (shared/reference/fat-standards.ts keys). */
export type BlendStandard = 'ground-beef' | 'hamburger' | 'fresh-pork-sausage';

/** The body of POST /api/blends/least-cost with the trims typed in (or prefilled from stock). */
export interface LeastCostRequest {
  readonly target: number;
  readonly batch: string;
  readonly standard?: BlendStandard;
  readonly trims: readonly {
    readonly name: string;
    readonly fat: number;
    /** Per kilogram. */
    readonly price: number;
    readonly onHand: string;
    readonly fatAsSuch?: boolean;
  }[];
}

/**
 * The costs API, for admins and reviewers: a batch's cost, a formula's cost per finished kg over
 * its batches, the trims on hand and the least-cost blend. Failures arrive as ApiErrors
 * (core/api/api-error-interceptor.ts).
 */
@Injectable({ providedIn: 'root' })
export class CostApi {
  private readonly http = inject(HttpClient);

  batchCost(lot: string): Promise<BatchCostRecord> {
    return firstValueFrom(
      this.http.get<BatchCostRecord>(`/api/batches/${encodeURIComponent(lot)}/cost`),
    );
  }

  formulaCosts(id: string): Promise<FormulaCosts> {
    return firstValueFrom(
      this.http.get<FormulaCosts>(`/api/formulas/${encodeURIComponent(id)}/costs`),
    );
  }

  async trims(): Promise<BlendTrims['trims']> {
    return (await firstValueFrom(this.http.get<BlendTrims>('/api/blends/trims'))).trims;
  }

  leastCost(request: LeastCostRequest): Promise<LeastCostAnswer> {
    return firstValueFrom(this.http.post<LeastCostAnswer>('/api/blends/least-cost', request));
  }
}
