// k for the adiabatic check of the protective conductor, A·√s/mm² (method-depth.md §6):
// IEC 60364-5-54 Tables A.54.2 (separate insulated conductor) and A.54.3 (a core of the cable),
// from memory; the same values appear in BS 7671:2018 Tables 54.2 and 54.3.

import type { Insulation, Material } from '../model/types.js';

export const K_TABLE_SOURCE =
  'IEC 60364-5-54 Tables A.54.2 and A.54.3 (from memory; the same values appear in BS 7671:2018 Tables 54.2 and 54.3)';

const K: Record<Material, Record<Insulation, { inCable: number; separate: number }>> = {
  Cu: { pvc: { inCable: 115, separate: 143 }, xlpe: { inCable: 143, separate: 176 } },
  Al: { pvc: { inCable: 76, separate: 95 }, xlpe: { inCable: 94, separate: 116 } },
};

export function kFactor(earthMaterial: Material, insulation: Insulation, earthInCable: boolean): number {
  const row = K[earthMaterial][insulation];
  return earthInCable ? row.inCable : row.separate;
}

export const K_TABLE = K;
