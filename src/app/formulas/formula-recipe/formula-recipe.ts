import { ChangeDetectionStrategy, Component, computed, inject, input } from '@angular/core';
import { MatIcon } from '@angular/material/icon';
import type { Formula } from '../formula-api-types';
import { FormulaStore } from '../formula-store';
import { recipeOf } from './recipe-words';

/**
 * A formula as a recipe, for the people who use it but do not edit it (cooks, reviewers): the
 * ingredients with their amounts, the timing (holds, lead days, pieces), the steps, the process
 * controls with their limits and what to do if one is missed, the cautions and notes, in plain
 * words. Presentational only.
 */
@Component({
  selector: 'app-formula-recipe',
  imports: [MatIcon],
  templateUrl: './formula-recipe.html',
  styleUrl: './formula-recipe.css',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class FormulaRecipe {
  private readonly store = inject(FormulaStore);

  /** The formula as read from its file. */
  readonly formula = input.required<Formula>();

  /** An assembly's parts by their titles, from the list of formulas, once it has arrived. */
  private readonly titles = computed(
    () =>
      new Map(
        (this.store.formulas() ?? []).flatMap((item) =>
          item.id && item.title ? [[item.id, item.title] as const] : [],
        ),
      ),
  );
  protected readonly recipe = computed(() => {
    const titles = this.titles();
    return recipeOf(this.formula(), (id) => titles.get(id) ?? id);
  });

  constructor() {
    // An assembly's parts are named by title: the list of formulas, read once and shared.
    if (this.store.formulas() === null) void this.store.loadList();
  }
}
