/**
 * One field of a panel's form read through its reader: a refusal (a ValidationError naming the field) is collected
 * in `errors` and the field outlined, its text kept; an accepted value clears the outline.
 */
import { ValidationError } from '../../validate/invalid.ts';

export function readField<T>(input: HTMLInputElement, reader: (text: string) => T, errors: string[]): T | undefined {
  try {
    const value = reader(input.value);
    input.classList.remove('invalid');
    return value;
  } catch (error) {
    if (!(error instanceof ValidationError)) throw error;
    input.classList.add('invalid');
    errors.push(error.message);
    return undefined;
  }
}
