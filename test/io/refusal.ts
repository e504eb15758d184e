import { expect } from 'vitest';
import { ValidationError } from '../../src/validate/invalid.ts';

/** The message of the ValidationError `run` throws (fails when it throws nothing or something else). */
export function refusal(run: () => unknown): string {
  try {
    run();
  } catch (error) {
    expect(error).toBeInstanceOf(ValidationError);
    return (error as Error).message;
  }
  throw new Error('accepted');
}
