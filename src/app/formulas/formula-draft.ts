import { Injectable, computed, effect, inject, signal, untracked } from '@angular/core';
import { takeUntilDestroyed, toObservable, toSignal } from '@angular/core/rxjs-interop';
import { NonNullableFormBuilder } from '@angular/forms';
import {
  catchError,
  debounceTime,
  distinctUntilChanged,
  map,
  of,
  startWith,
  switchMap,
} from 'rxjs';
import { ApiError } from '../core/api/api-error';
import { messageOf } from '../core/api/message-of';
import {
  Formula,
  FormulaDetail,
  FormulaKind,
  FormulaProblem,
  WriteOutcome,
} from './formula-api-types';
import { createFormulaForm } from './formula-form-model';
import { fillFormulaForm } from './fill-formula-form';
import { formulaFromForm } from './formula-from-form';
import { FormulaStore } from './formula-store';
import { formulaLimitProblem, parseFormulaYaml, writeFormulaYaml } from './formula-yaml';
import { problemsOf } from './formula-problems/problems-of';

/** Where the last edit was made: it decides what a save sends. */
export type EditedIn = 'form' | 'yaml';

/** The state of checking the draft text. */
export interface DraftValidation {
  readonly status: 'idle' | 'checking' | 'done' | 'failed';
  /** The text that was checked. */
  readonly text: string;
  readonly usable: boolean;
  readonly problems: readonly FormulaProblem[];
  /** Why checking failed (the server could not be reached…). */
  readonly message?: string;
}

/** What came of a save. */
export type SaveResult =
  | { readonly kind: 'saved'; readonly outcome: WriteOutcome }
  | { readonly kind: 'conflict'; readonly loadedRevision: string; readonly message: string }
  | { readonly kind: 'invalid'; readonly message: string; readonly problems: FormulaProblem[] }
  | { readonly kind: 'failed'; readonly message: string };

const KNOWN_KINDS: readonly FormulaKind[] = ['cure', 'dough', 'blend', 'mix', 'assembly'];
const IDLE: DraftValidation = { status: 'idle', text: '', usable: false, problems: [] };

/**
 * The formula being edited on the formula page: the file as loaded, the draft YAML, the structured
 * form kept in step with it, and the draft checked as it is typed. Provided by the page, so every
 * visit starts fresh.
 */
@Injectable()
export class FormulaDraft {
  private readonly store = inject(FormulaStore);
  private readonly fb = inject(NonNullableFormBuilder);
  private readonly detailState = signal<FormulaDetail | null>(null);
  private readonly loadingState = signal(false);
  private readonly loadErrorState = signal<string | null>(null);
  private readonly yamlState = signal('');
  private readonly editedInState = signal<EditedIn | null>(null);
  private readonly kindState = signal<FormulaKind | null>(null);
  private readonly titleState = signal<string | null>(null);
  // The formula the form was last filled from: keys the form does not edit come from here.
  private base: Formula | null = null;
  private filledFrom = '';
  // True while the form is being filled from YAML: its change events are not edits.
  private filling = false;
  // Counts loads, so that an answer for a formula left meanwhile is dropped.
  private loads = 0;

  /** The structured form of the draft. */
  readonly form = createFormulaForm(this.fb);
  /** The formula file as loaded (or as saved last). */
  readonly detail = this.detailState.asReadonly();
  /** Whether the formula is being fetched. */
  readonly loading = this.loadingState.asReadonly();
  /** Why the formula could not be fetched; null when it could. */
  readonly loadError = this.loadErrorState.asReadonly();
  /** The draft YAML text. */
  readonly yaml = this.yamlState.asReadonly();
  /** Where the last edit was made; null before any edit. */
  readonly editedIn = this.editedInState.asReadonly();
  /** The kind of the formula the form shows. */
  readonly kind = this.kindState.asReadonly();
  /** The title of the formula as loaded, when it has one. */
  readonly title = this.titleState.asReadonly();
  /** Whether the draft differs from the file as loaded. */
  readonly dirty = computed(() => {
    const detail = this.detailState();
    return detail !== null && this.yamlState() !== detail.yaml;
  });
  /** The draft text checked by the server, about 400 ms after the last keystroke. */
  readonly validation = toSignal(
    toObservable(this.yamlState).pipe(
      debounceTime(400),
      distinctUntilChanged(),
      switchMap((text) => this.check(text)),
    ),
    { initialValue: IDLE },
  );
  /** Whether the draft has changed since it was last checked. */
  readonly checking = computed(
    () => this.validation().text !== this.yamlState() || this.validation().status === 'checking',
  );
  /** Whether the form shows what the YAML says (it cannot while the YAML has errors). */
  readonly formInStep = computed(() => {
    const edited = this.editedInState();
    if (edited === 'form' || (edited === null && this.detailState()?.valid)) return true;
    const checked = this.validation();
    return checked.text === this.yamlState() && checked.usable;
  });

  constructor() {
    this.form.valueChanges.pipe(takeUntilDestroyed()).subscribe(() => {
      this.followForm();
    });
    // YAML → form: once a YAML edit checks out, the form shows it.
    effect(() => {
      const checked = this.validation();
      if (this.editedInState() !== 'yaml' || !checked.usable) return;
      if (checked.text !== this.yamlState() || checked.text === this.filledFrom) return;
      untracked(() => this.fillFrom(checked.text));
    });
  }

  /** Fetches a formula and starts a fresh draft of it. */
  async load(id: string): Promise<void> {
    const load = ++this.loads;
    this.loadingState.set(true);
    this.loadErrorState.set(null);
    try {
      const detail = await this.store.get(id);
      if (load === this.loads) this.reset(detail);
    } catch (error) {
      if (load !== this.loads) return;
      this.detailState.set(null);
      this.loadErrorState.set(
        error instanceof ApiError && error.status === 404
          ? `There is no formula called “${id}”.`
          : messageOf(error),
      );
    } finally {
      this.loadingState.set(false);
    }
  }

  /** Throws the draft away and takes the formula as it is on disk now. */
  async reload(): Promise<void> {
    const detail = this.detailState();
    if (detail) await this.load(detail.id);
  }

  /** The YAML view was edited. */
  editYaml(text: string): void {
    this.yamlState.set(text);
    this.editedInState.set('yaml');
  }

  /**
   * Saves the draft with a message, as YAML when it was last edited as text, otherwise as the
   * formula (the server writes it into the file keeping its comments).
   */
  async save(message: string): Promise<SaveResult> {
    const detail = this.detailState();
    if (!detail) return { kind: 'failed', message: 'The formula is not loaded.' };
    const body =
      this.editedInState() === 'form' && this.base
        ? { formula: formulaFromForm(this.form, this.base), message }
        : { yaml: this.yamlState(), message };
    try {
      const outcome = await this.store.save(detail.id, detail.revision, body);
      this.reset(await this.store.get(detail.id));
      return { kind: 'saved', outcome };
    } catch (error) {
      if (error instanceof ApiError && error.status === 409 && error.code === 'stale-revision') {
        return { kind: 'conflict', loadedRevision: detail.revision, message: error.message };
      }
      const problems = problemsOf(error);
      if (error instanceof ApiError && problems.length > 0) {
        return { kind: 'invalid', message: error.message, problems };
      }
      return { kind: 'failed', message: messageOf(error) };
    }
  }

  private reset(detail: FormulaDetail): void {
    this.detailState.set(detail);
    this.editedInState.set(null);
    this.yamlState.set(detail.yaml);
    // A file with errors comes without a formula: the form shows what its YAML says.
    this.fillFrom(detail.yaml, detail.formula ?? undefined);
  }

  private fillFrom(text: string, formula = parseFormulaYaml(text)): void {
    this.filledFrom = text;
    if (!formula) return;
    this.base = formula;
    if (text === this.detailState()?.yaml) {
      this.titleState.set(typeof formula.title === 'string' ? formula.title : null);
    }
    this.kindState.set(KNOWN_KINDS.includes(formula.kind) ? formula.kind : null);
    const disabled = this.form.disabled;
    this.filling = true;
    try {
      fillFormulaForm(this.form, formula, this.fb);
      // Rows added while the form is read-only come enabled: keep it all read-only.
      if (disabled) this.form.disable({ emitEvent: false });
    } finally {
      this.filling = false;
    }
  }

  private followForm(): void {
    if (this.filling || !this.base || this.form.disabled) return;
    const formula = formulaFromForm(this.form, this.base);
    const text = writeFormulaYaml(this.yamlState(), formula);
    this.filledFrom = text;
    this.yamlState.set(text);
    this.editedInState.set('form');
  }

  private check(text: string) {
    if (text.trim() === '') {
      return of<DraftValidation>({
        status: 'done',
        text,
        usable: false,
        problems: [],
        message: 'The YAML is empty.',
      });
    }
    // Refused here as the server would refuse it, without sending or parsing the text.
    const refused = formulaLimitProblem(text);
    if (refused) {
      return of<DraftValidation>({ status: 'done', text, usable: false, problems: [refused] });
    }
    return this.store.validate(text).pipe(
      map((result): DraftValidation => ({ status: 'done', text, ...result })),
      catchError((error: unknown) =>
        of<DraftValidation>({
          status: 'failed',
          text,
          usable: false,
          problems: [],
          message: messageOf(error),
        }),
      ),
      startWith<DraftValidation>({ status: 'checking', text, usable: false, problems: [] }),
    );
  }
}
