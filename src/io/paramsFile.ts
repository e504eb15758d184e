/**
 * The parameter file (DESIGN.md, parameter-file contract): the text of a file, read and handed to the field
 * validation of src/tb/paramsCheck.ts (limits documented there).
 */
import { invalid } from '../validate/invalid.ts';
import { PARAMETER_LIMITS, validateParameterObject } from '../tb/paramsCheck.ts';
import type { ParameterSet } from '../tb/parameterSet.ts';

/** Parses and validates the text of a parameter file; throws ValidationError naming the first bad field. */
export function parseParameterFile(content: string, origin = 'parameters'): ParameterSet {
  if (typeof content !== 'string') invalid(origin, content, 'expected the text of a JSON file');
  if (content.length > PARAMETER_LIMITS.fileBytes) {
    invalid(origin, `${content.length} characters`, `larger than ${PARAMETER_LIMITS.fileBytes} characters`);
  }
  let value: unknown;
  try {
    value = JSON.parse(content);
  } catch (error) {
    invalid(origin, content, `not valid JSON: ${(error as Error).message}`);
  }
  return validateParameterObject(value);
}
