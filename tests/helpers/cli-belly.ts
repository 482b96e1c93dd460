/**
 * `larder calc` of the demo's belly cure, 4.26 kg at 4 cm, starting on `start`: the batch the CLI
 * suites calculate and record. `formula` names it by id (default) or by its file.
 */
export function bellyCalc(start: string, formula = 'quillmoor-belly'): string[] {
  return ['calc', formula, '--meat', '4.26kg', '--thickness', '4cm', '--start', start];
}
