import { Pipe, type PipeTransform } from '@angular/core';

/** A number followed by a space and its unit; the unit ends where a word would. */
const NUMBER_AND_UNIT = /(\d) (°[CF]|kg|g|lb|oz|ppm|min|h|s|cm|in|%)(?![\p{L}\d])/gu;

/**
 * Words with every number held to its unit by a no-break space ("77 °F" never splits into
 * "77" at a line's end and "°F" at the next's), so a narrow screen still reads each figure whole.
 */
export function unitsTogether(text: string): string {
  return text.replace(NUMBER_AND_UNIT, '$1\u00a0$2');
}

/** `unitsTogether` in a template: `{{ deviation.what | unitsTogether }}`. */
@Pipe({ name: 'unitsTogether' })
export class UnitsTogetherPipe implements PipeTransform {
  transform(text: string | null | undefined): string {
    return text ? unitsTogether(text) : '';
  }
}
