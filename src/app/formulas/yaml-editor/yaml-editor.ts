import {
  ChangeDetectionStrategy,
  Component,
  ElementRef,
  computed,
  input,
  output,
  signal,
  viewChild,
} from '@angular/core';

let nextId = 0;

/**
 * A plain-text editor for formula YAML: a monospace textarea with line numbers in a gutter, that
 * can put the caret on a given line and column (from a problem). No highlighting, no magic keys:
 * Tab leaves the field, as it does everywhere else.
 */
@Component({
  selector: 'app-yaml-editor',
  templateUrl: './yaml-editor.html',
  styleUrl: './yaml-editor.css',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class YamlEditor {
  /** The text shown. */
  readonly text = input.required<string>();
  /** Whether the text can only be read. */
  readonly readOnly = input(false);
  /** The label of the field. */
  readonly label = input('Formula as YAML');
  /** Id of an element that describes the field (the problems summary). */
  readonly describedBy = input<string | null>(null);
  /** Emits the whole text after each edit. */
  readonly edited = output<string>();

  private readonly area = viewChild.required<ElementRef<HTMLTextAreaElement>>('area');
  protected readonly id = `yaml-editor-${nextId++}`;
  protected readonly scrollTop = signal(0);
  protected readonly lineNumbers = computed(() => {
    const count = this.text().split('\n').length;
    return Array.from({ length: count }, (_, i) => i + 1).join('\n');
  });

  /** Puts the caret at a 1-based line and column, scrolls it into view and focuses the field. */
  moveCaretTo(line: number, column: number): void {
    const area = this.area().nativeElement;
    const lines = area.value.split('\n');
    const row = Math.min(Math.max(line, 1), lines.length);
    let offset = 0;
    for (let i = 0; i < row - 1; i++) offset += lines[i].length + 1;
    offset += Math.min(Math.max(column - 1, 0), lines[row - 1].length);
    area.focus();
    area.setSelectionRange(offset, offset);
    const lineHeight = parseFloat(getComputedStyle(area).lineHeight) || 20;
    area.scrollTop = Math.max(0, (row - 3) * lineHeight);
    this.scrollTop.set(area.scrollTop);
  }

  protected typed(event: Event): void {
    this.edited.emit((event.target as HTMLTextAreaElement).value);
  }

  protected scrolled(event: Event): void {
    this.scrollTop.set((event.target as HTMLTextAreaElement).scrollTop);
  }
}
