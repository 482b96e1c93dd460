import { Pipe, PipeTransform } from '@angular/core';
import { optionsInWords } from '../../../shared/presentation/option-words.ts';

/**
 * A calculation's message with each command-line option in a field's words ("give --room" →
 * "give the room temperature"): the console has boxes, not flags.
 */
@Pipe({ name: 'optionWords' })
export class OptionWordsPipe implements PipeTransform {
  transform(message: string): string {
    return optionsInWords(message);
  }
}
