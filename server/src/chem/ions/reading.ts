import type { Formula } from '../formula/ast';

/** Pick between the two readings of a bare trailing `<digits><sign>` (see formula/parse.ts). */
export function chooseReading(f: Formula): Formula {
  return f;
}
