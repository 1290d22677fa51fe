import { visibilitySentence as sentence } from '@/shared/fixes/visibility-sentence';
import type { FixVisibility } from '@/shared/schemas/fix';
import { convertLength, type LengthUnit } from '@/shared/units/length';

/** A post's view of the fix in words, heights in the reader's unit (rounded up: never promise a lower smoke). */
export function visibilitySentence(v: FixVisibility, heightUnit: LengthUnit): string {
  return sentence(v, (m) => `${Math.ceil(convertLength(m, 'm', heightUnit))} ${heightUnit}`);
}
