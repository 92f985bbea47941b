/* No jspdf here: the editor's toolbar reads the sizes without loading the PDF code. */

/**
 * Drawing sheets the set prints on, landscape, in points (1/72 in): ANSI B 17 × 11 in and ANSI D
 * 34 × 22 in (ASME Y14.1), ARCH D 36 × 24 in (the architectural series).
 */
export const SHEET_SIZES = {
  'ansi-b': { name: 'ANSI B (17 × 11 in)', short: 'ANSI B', w: 1224, h: 792 },
  'ansi-d': { name: 'ANSI D (34 × 22 in)', short: 'ANSI D', w: 2448, h: 1584 },
  'arch-d': { name: 'ARCH D (36 × 24 in)', short: 'ARCH D', w: 2592, h: 1728 },
} as const;
export type SheetSize = keyof typeof SHEET_SIZES;
export const SHEET_SIZE_IDS = Object.keys(SHEET_SIZES) as SheetSize[];
