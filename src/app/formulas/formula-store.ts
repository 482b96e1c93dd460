import { HttpClient, HttpHeaders } from '@angular/common/http';
import { Injectable, computed, inject, signal } from '@angular/core';
import { Observable, firstValueFrom } from 'rxjs';
import { messageOf } from '../core/api/message-of';
import {
  BatchOptions,
  Formula,
  FormulaDetail,
  FormulaDiff,
  FormulaPreview,
  FormulaRevisions,
  FormulaSummary,
  FormulaValidation,
  UnitSystem,
  WriteOutcome,
} from './formula-api-types';

const API = '/api/formulas';

/** What a save sends: the YAML text, or the formula as JSON (merged into the file by the server). */
export type FormulaChangeBody =
  | { readonly yaml: string; readonly message: string }
  | { readonly formula: Formula; readonly message: string };

/**
 * The Formulas area's state and its conversation with the API: the list of formula files (signal
 * state), and the typed requests the formula page makes. RxJS stays in here, at the HTTP edge.
 */
@Injectable({ providedIn: 'root' })
export class FormulaStore {
  private readonly http = inject(HttpClient);
  private readonly listState = signal<readonly FormulaSummary[] | null>(null);
  private readonly loadingState = signal(false);
  private readonly errorState = signal<string | null>(null);

  /** Every formula file, or null before the first load. */
  readonly formulas = this.listState.asReadonly();
  /** Whether the list is being fetched. */
  readonly loading = this.loadingState.asReadonly();
  /** Why the list could not be fetched, in words; null when it could. */
  readonly error = this.errorState.asReadonly();
  /** The kinds that occur in the list, in the order the product names them. */
  readonly kinds = computed(() => {
    const present = new Set(this.listState()?.map((item) => item.kind));
    return (['cure', 'dough', 'blend', 'mix', 'assembly'] as const).filter((kind) =>
      present.has(kind),
    );
  });

  /** Fetches the list of formulas again. */
  async loadList(): Promise<void> {
    this.loadingState.set(true);
    this.errorState.set(null);
    try {
      const body = await firstValueFrom(this.http.get<{ formulas: FormulaSummary[] }>(API));
      this.listState.set(body.formulas);
    } catch (error) {
      this.errorState.set(messageOf(error));
    } finally {
      this.loadingState.set(false);
    }
  }

  /** One formula as it is on disk now, with its revision. */
  get(id: string): Promise<FormulaDetail> {
    return firstValueFrom(this.http.get<FormulaDetail>(`${API}/${encodeURIComponent(id)}`));
  }

  /** Checks a YAML text as `larder check` would, writing nothing. */
  validate(yaml: string): Observable<FormulaValidation> {
    return this.http.post<FormulaValidation>(`${API}/validate`, { yaml });
  }

  /** Calculates a sample batch of a formula: of the unsaved YAML when given, else of the saved one. */
  preview(
    id: string,
    yaml: string | undefined,
    batch: BatchOptions,
    units: UnitSystem,
  ): Observable<FormulaPreview> {
    return this.http.post<FormulaPreview>(`${API}/${encodeURIComponent(id)}/preview`, {
      ...(yaml === undefined ? {} : { yaml }),
      batch,
      units,
    });
  }

  /**
   * Saves a change made on `revision`.
   * @throws ApiError 409 stale-revision when the file changed since; 422 with the problems
   */
  save(id: string, revision: string, body: FormulaChangeBody): Promise<WriteOutcome> {
    return firstValueFrom(
      this.http.put<WriteOutcome>(`${API}/${encodeURIComponent(id)}`, body, {
        headers: new HttpHeaders({ 'If-Match': `"${revision}"` }),
      }),
    );
  }

  /**
   * Adds a new formula from its YAML text.
   * @throws ApiError 409 formula-exists; 422 with the problems; 400 bad-id
   */
  async create(yaml: string, message: string): Promise<WriteOutcome> {
    const outcome = await firstValueFrom(this.http.post<WriteOutcome>(API, { yaml, message }));
    void this.loadList();
    return outcome;
  }

  /**
   * Uploads a formula file; the file is named by the id inside it.
   * @throws ApiError 409 formula-exists; 415 not YAML; 413 too large; 422 with the problems
   */
  async upload(file: File, message?: string): Promise<WriteOutcome> {
    const form = new FormData();
    form.append('file', file, file.name);
    if (message) form.append('message', message);
    const outcome = await firstValueFrom(this.http.post<WriteOutcome>(`${API}/upload`, form));
    void this.loadList();
    return outcome;
  }

  /** A formula's history, newest first. */
  revisions(id: string): Promise<FormulaRevisions> {
    return firstValueFrom(
      this.http.get<FormulaRevisions>(`${API}/${encodeURIComponent(id)}/revisions`),
    );
  }

  /** A line diff between two revisions; `to` left out means the revision on disk now. */
  diff(id: string, from: string, to?: string): Promise<FormulaDiff> {
    const params: Record<string, string> = to ? { from, to } : { from };
    return firstValueFrom(
      this.http.get<FormulaDiff>(`${API}/${encodeURIComponent(id)}/diff`, { params }),
    );
  }
}
