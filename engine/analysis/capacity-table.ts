// Default current-carrying capacities for the iec basis (method-depth.md §4).
//
// IEC 60364-5-52:2009 Tables B.52.4 and B.52.5, reference method C (clipped direct), conductor
// 70 °C (PVC) or 90 °C (XLPE), ambient 30 °C. FROM MEMORY: verify against the standard before
// relying on these values. Under au-nz there is no built-in table: the user enters Iz.

import type { Insulation, Material } from '../model/types.js';

export const CAPACITY_TABLE_SOURCE =
  'IEC 60364-5-52:2009 Tables B.52.4 and B.52.5, reference method C (clipped direct), conductor 70 °C (PVC) or 90 °C (XLPE), ambient 30 °C; from memory, verify against the standard before relying on it';

type Row = [size: number, cuPvc2: number, cuPvc3: number, cuXlpe2: number, cuXlpe3: number, alPvc2: number | null, alPvc3: number | null, alXlpe2: number | null, alXlpe3: number | null];

const ROWS: readonly Row[] = [
  [1.5, 19.5, 17.5, 24, 22, null, null, null, null],
  [2.5, 27, 24, 33, 30, 21, 18.5, 26, 23],
  [4, 36, 32, 45, 40, 28, 25, 35, 31],
  [6, 46, 41, 58, 52, 36, 32, 45, 40],
  [10, 63, 57, 80, 71, 49, 44, 62, 54],
  [16, 85, 76, 107, 96, 66, 59, 84, 73],
  [25, 112, 96, 138, 119, 83, 73, 101, 89],
  [35, 138, 119, 171, 147, 103, 90, 126, 111],
  [50, 168, 144, 209, 179, 125, 110, 154, 135],
  [70, 213, 184, 269, 229, 160, 140, 198, 173],
  [95, 258, 223, 328, 278, 195, 170, 241, 210],
  [120, 299, 259, 382, 322, 226, 197, 280, 244],
  [150, 344, 299, 441, 371, 261, 227, 324, 282],
  [185, 392, 341, 506, 424, 298, 259, 371, 322],
  [240, 461, 403, 599, 500, 352, 305, 439, 380],
  [300, 530, 464, 693, 576, 406, 351, 508, 439],
];

/** The table's rating of one set (A), or null when the size is not in the table. */
export function tableCapacity(material: Material, insulation: Insulation, loaded: 2 | 3, size: number): number | null {
  const row = ROWS.find((r) => Math.abs(r[0] - size) < 1e-9);
  if (!row) return null;
  const column = (material === 'Al' ? 4 : 0) + (insulation === 'xlpe' ? 2 : 0) + (loaded === 3 ? 1 : 0);
  return row[1 + column] ?? null;
}

/** Every row, for the assumptions sheet: [size, the eight columns in the order above]. */
export const CAPACITY_ROWS = ROWS;
