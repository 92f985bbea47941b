import type { Insulation } from '../model/schema';
import type { TempColumnC } from './ampacity310_16';

/**
 * Temperature rating and thermal class of the insulation types the schema
 * offers: NFPA 70-2023 / 2020 Table 310.4(1) (conductor applications and
 * insulations), common types only.
 *
 * Source: from memory, checked against public reproductions.
 * Independent check: test/core/tables/insulation.test.ts (every schema type is
 * mapped; the "-2" and "HH" types are 90 °C, the "W"-only types 75 °C, TW/UF
 * 60 °C; manufacturers' type letters: H = 75 °C, HH = 90 °C, W = wet, common practice).
 *
 * Which rating: the drawing does not say whether a run is in a wet or a dry
 * location, so each type gets the rating the trade designs with for building
 * feeders. THHN, THHW, XHHW-2, RHH, RHW-2, THWN-2 and USE-2 take their 90 °C
 * (dry) rating, because derating from the 90 °C column is what 310.15 allows
 * and the terminal limit of 110.14(C) still caps the result; a wet location
 * would drop THHN to the THWN 75 °C rating and THHW/XHHW to 75 °C, which the
 * user states by choosing THWN or XHHW. XHHW is taken at its 75 °C wet rating
 * for that reason (its 90 °C dry rating is XHHW-2's job here). THW, THWN, RHW
 * and USE are 75 °C; TW and UF are 60 °C.
 *
 * Thermal class feeds the short-circuit withstand check (ICEA P-32-382:
 * 150 °C final temperature for thermoplastic, 250 °C for thermoset).
 */
export type ThermalClass = 'thermoplastic' | 'thermoset';

export interface InsulationRating {
  tempC: TempColumnC;
  thermalClass: ThermalClass;
}

export const INSULATION_SOURCE = 'NFPA 70-2023 / 2020 Table 310.4(1), common types, from memory, checked against public reproductions';

export const INSULATION_RATINGS: Readonly<Record<Insulation, InsulationRating>> = Object.freeze({
  TW: { tempC: 60, thermalClass: 'thermoplastic' },
  UF: { tempC: 60, thermalClass: 'thermoplastic' },
  THW: { tempC: 75, thermalClass: 'thermoplastic' },
  THWN: { tempC: 75, thermalClass: 'thermoplastic' },
  RHW: { tempC: 75, thermalClass: 'thermoset' },
  XHHW: { tempC: 75, thermalClass: 'thermoset' },
  USE: { tempC: 75, thermalClass: 'thermoset' },
  THHN: { tempC: 90, thermalClass: 'thermoplastic' },
  'THWN-2': { tempC: 90, thermalClass: 'thermoplastic' },
  THHW: { tempC: 90, thermalClass: 'thermoplastic' },
  'XHHW-2': { tempC: 90, thermalClass: 'thermoset' },
  RHH: { tempC: 90, thermalClass: 'thermoset' },
  'RHW-2': { tempC: 90, thermalClass: 'thermoset' },
  'USE-2': { tempC: 90, thermalClass: 'thermoset' },
});

/** Temperature rating and thermal class of an insulation type. */
export function insulationRating(insulation: Insulation): InsulationRating {
  return INSULATION_RATINGS[insulation];
}
