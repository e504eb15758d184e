/**
 * The Metal panel's model fields (W_S, Δc, d, d0) as typed text → the alignment parameters. Each field is read
 * on its own: an empty one means the estimated default, a bad one is refused with its name and reason and the
 * others are still used; then d ≥ d0 is checked across the two (the field just edited is the one refused).
 */
import { ValidationError, invalid, show } from '../validate/invalid.ts';
import { ALIGNMENT_FLAG_LIMITS, type AlignmentField } from '../substrate/alignmentLimits.ts';
import { alignmentParameters, type AlignmentParameters } from '../substrate/transfer.ts';

/** The label of each field as the panel shows it (and as its errors name it). */
export const METAL_FIELD_NAMES: Record<AlignmentField, string> = {
  sheetWorkFunction: 'sheet work function W_S',
  dipole: 'interface dipole Δc',
  distance: 'distance d',
  d0: 'd0',
};

export const ALIGNMENT_FIELDS = Object.keys(METAL_FIELD_NAMES) as AlignmentField[];

/** One field's text → its value (undefined when empty: the default), or `invalid <name>: <text> (<why>)`. */
export function readMetalField(field: AlignmentField, text: string): number | undefined {
  const trimmed = text.trim();
  if (trimmed === '') return undefined;
  const x = Number(trimmed);
  const name = METAL_FIELD_NAMES[field];
  if (!Number.isFinite(x)) invalid(name, trimmed, 'not a number');
  const [low, high] = ALIGNMENT_FLAG_LIMITS[field];
  if (!(x >= low && x <= high)) invalid(name, trimmed, `must lie in [${low}, ${high}] ${field === 'distance' || field === 'd0' ? 'Å' : 'eV'}`);
  return x;
}

/**
 * The fields' texts on top of `current` (the model in the view): the good fields taken, the bad ones reported
 * and left at their current value. `edited` is the field the user just changed, refused first when d < d0.
 */
export function readMetalFields(
  texts: Record<AlignmentField, string>,
  current: AlignmentParameters,
  edited?: AlignmentField,
): { model: AlignmentParameters; errors: ValidationError[] } {
  const model: AlignmentParameters = { ...current };
  const errors: ValidationError[] = [];
  for (const field of ALIGNMENT_FIELDS) {
    try {
      const value = readMetalField(field, texts[field]);
      if (value === undefined) delete model[field];
      else model[field] = value;
    } catch (error) {
      if (!(error instanceof ValidationError)) throw error;
      errors.push(error);
    }
  }
  try {
    alignmentParameters(model, { distance: METAL_FIELD_NAMES.distance, d0: METAL_FIELD_NAMES.d0 });
  } catch (error) {
    if (!(error instanceof ValidationError)) throw error;
    const refused: AlignmentField = edited === 'd0' || edited === 'distance' ? edited : error.field === METAL_FIELD_NAMES.d0 ? 'd0' : 'distance';
    const kept = { ...model };
    if (current[refused] === undefined) delete kept[refused];
    else kept[refused] = current[refused];
    const value = texts[refused].trim();
    errors.push(new ValidationError(METAL_FIELD_NAMES[refused], show(value), error.why));
    return { model: kept, errors };
  }
  return { model, errors };
}
