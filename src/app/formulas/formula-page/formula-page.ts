import {
  ChangeDetectionStrategy,
  Component,
  Injector,
  afterNextRender,
  computed,
  effect,
  inject,
  input,
  signal,
  untracked,
  viewChild,
} from '@angular/core';
import { MatButton } from '@angular/material/button';
import { MAT_FORM_FIELD_DEFAULT_OPTIONS } from '@angular/material/form-field';
import { MatIcon } from '@angular/material/icon';
import { MatProgressBar } from '@angular/material/progress-bar';
import { MatTab, MatTabGroup } from '@angular/material/tabs';
import { Title } from '@angular/platform-browser';
import { RouterLink } from '@angular/router';
import { SessionStore } from '../../core/auth/session-store';
import { saveBlob } from '../../ui/save-blob';
import { AssemblyPreview } from '../assembly-preview/assembly-preview';
import { FormulaProblem } from '../formula-api-types';
import { FormulaRecipe } from '../formula-recipe/formula-recipe';
import { revisionInWords } from '../revision-words';
import { FormulaDraft } from '../formula-draft';
import { FormulaForm } from '../formula-form/formula-form';
import { FormulaHistory } from '../formula-history/formula-history';
import { FormulaCostChart } from '../../costing/formula-cost-chart/formula-cost-chart';
import { FormulaPreview } from '../formula-preview/formula-preview';
import { FormulaProblems } from '../formula-problems/formula-problems';
import { FormulaSave } from '../formula-save/formula-save';
import { KIND_LABELS } from '../formula-vocabulary';
import { LeavesSafely } from '../unsaved-changes-guard';
import { watchControl } from '../watch-control';
import { YamlEditor } from '../yaml-editor/yaml-editor';
import { IsoDayPipe } from '../../ui/batch-sheet/iso-day-pipe';

const YAML_TAB = 1;

/**
 * One formula. Admins: the structured form and the YAML side by side in tabs, kept in step and
 * checked as they are typed, and a save bar that stays in reach at the foot of the screen with
 * the problem count beside it. Cooks and reviewers: the formula as a recipe to read. Everyone: a
 * live preview of a sample batch, the history in words with side-by-side differences, and the
 * YAML to download.
 */
@Component({
  selector: 'app-formula-page',
  imports: [
    IsoDayPipe,
    FormulaCostChart,
    RouterLink,
    MatButton,
    MatIcon,
    MatProgressBar,
    MatTabGroup,
    MatTab,
    FormulaForm,
    YamlEditor,
    FormulaProblems,
    FormulaPreview,
    FormulaSave,
    FormulaHistory,
    AssemblyPreview,
    FormulaRecipe,
  ],
  providers: [
    FormulaDraft,
    // Hints here run to two lines: let them push the next row down rather than overlap it.
    {
      provide: MAT_FORM_FIELD_DEFAULT_OPTIONS,
      useValue: { appearance: 'outline', subscriptSizing: 'dynamic' },
    },
  ],
  templateUrl: './formula-page.html',
  styleUrl: './formula-page.css',
  changeDetection: ChangeDetectionStrategy.OnPush,
  host: { '(window:beforeunload)': 'warnBeforeUnload($event)' },
})
export default class FormulaPage implements LeavesSafely {
  private readonly session = inject(SessionStore);
  private readonly title = inject(Title);
  private readonly injector = inject(Injector);
  protected readonly draft = inject(FormulaDraft);

  /** The formula's id, from the route. */
  readonly id = input.required<string>();

  private readonly editor = viewChild(YamlEditor);
  protected readonly tab = signal(0);
  protected readonly isAdmin = computed(() => this.session.person()?.role === 'admin');
  protected readonly kindLabel = computed(() => {
    const kind = this.draft.kind();
    return kind ? KIND_LABELS[kind] : 'Unknown kind';
  });
  /** How the formula last changed, in words: "Edited in the console by Rosa Quennick". */
  protected readonly lastChange = computed(() => {
    const detail = this.draft.detail();
    if (!detail) return '';
    const words = revisionInWords({
      source: detail.lastChangeSource,
      author: detail.lastChangedBy,
    });
    return words[0].toUpperCase() + words.slice(1);
  });
  /** The problems counted for the save bar: "2 errors, 1 warning", "No problems". */
  protected readonly problemWords = computed(() => {
    const problems = this.problems();
    const errors = problems.filter((p) => p.severity === 'error').length;
    const warnings = problems.length - errors;
    const parts = [
      errors ? `${errors} ${errors === 1 ? 'error' : 'errors'}` : '',
      warnings ? `${warnings} ${warnings === 1 ? 'warning' : 'warnings'}` : '',
    ].filter(Boolean);
    return { errors, text: parts.length ? parts.join(', ') : 'No problems' };
  });
  protected readonly cureMethod = watchControl(
    signal(this.draft.form),
    (form) => form.controls.cure.controls.method.value,
  );
  protected readonly problems = computed(() => this.draft.validation().problems);
  protected readonly checkStatus = computed(() => {
    const checked = this.draft.validation();
    if (this.draft.checking()) return 'Checking…';
    if (checked.status === 'failed') return `Could not check: ${checked.message}`;
    if (checked.message) return checked.message;
    const errors = checked.problems.filter((p) => p.severity === 'error').length;
    if (errors > 0) return `${errors} ${errors === 1 ? 'error' : 'errors'}: not usable yet`;
    return checked.problems.length > 0 ? 'Usable, with warnings' : 'Valid: no problems';
  });

  constructor() {
    effect(() => {
      const id = this.id();
      untracked(() => void this.draft.load(id));
    });
    effect(() => {
      if (this.isAdmin()) this.draft.form.enable({ emitEvent: false });
      else this.draft.form.disable({ emitEvent: false });
    });
    effect(() => {
      const name = this.draft.title() ?? this.draft.detail()?.id;
      if (name) this.title.setTitle(`${name} · Formulas · Larderbook`);
    });
    // A file with errors opens on its YAML, where the problems can be found.
    effect(() => {
      const detail = this.draft.detail();
      if (detail && (!detail.valid || this.draft.kind() === null)) this.tab.set(YAML_TAB);
    });
  }

  /** Asks before leaving with unsaved changes. */
  canLeave(): boolean {
    return (
      !this.draft.dirty() ||
      window.confirm('This formula has changes that are not saved. Leave and lose them?')
    );
  }

  protected warnBeforeUnload(event: BeforeUnloadEvent): void {
    if (this.draft.dirty()) event.preventDefault();
  }

  protected chooseTab(index: number): void {
    this.tab.set(index);
  }

  protected showProblem(problem: FormulaProblem): void {
    this.tab.set(YAML_TAB);
    afterNextRender(() => this.editor()?.moveCaretTo(problem.line, problem.column), {
      injector: this.injector,
    });
  }

  protected download(): void {
    const detail = this.draft.detail();
    if (!detail) return;
    const blob = new Blob([this.draft.yaml()], { type: 'application/yaml;charset=utf-8' });
    saveBlob(blob, `${detail.id}.yaml`);
  }
}
