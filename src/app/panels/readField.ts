/**
 * One field of a panel read through its checker: a refusal outlines the field (class `invalid`), adds its message to
 * `errors` and gives undefined, and the field keeps the text the user typed; a good value clears the outline.
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
