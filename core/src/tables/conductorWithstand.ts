import type { Material } from '../model/schema';
import type { ThermalClass } from './insulation';

/**
 * Short-circuit withstand of an insulated conductor, ICEA P-32-382 (also in
 * IEEE Std 242): (I/A)²·t = K·log10((T2 + T0)/(T1 + T0)), I in amperes, A in
 * circular mils, t in seconds; copper K = 0.0297, T0 = 234; aluminum
 * K = 0.0125, T0 = 228. T1 is the conductor's temperature rating (its
 * operating temperature at full load), T2 the short-time limit of the
 * insulation: 150 °C thermoplastic, 250 °C thermoset.
 *
 * Source: ICEA P-32-382 constants as published; from memory, checked against
 * the derivation from copper and aluminum resistivity and heat capacity
 * (test/core/tables/conductorWithstand.test.ts). Copper-clad aluminum takes
 * the aluminum constants (conservative: aluminum's K is the smaller).
 */
export const WITHSTAND_SOURCE = 'ICEA P-32-382 (also IEEE Std 242), from memory, checked against the adiabatic heating derivation';

export const ICEA_CONSTANTS: Readonly<Record<'cu' | 'al', { k: number; t0C: number }>> = {
  cu: { k: 0.0297, t0C: 234 },
  al: { k: 0.0125, t0C: 228 },
};

/** Final short-circuit temperature of the insulation class, °C. */
export function finalTempC(thermal: ThermalClass): number {
  return thermal === 'thermoset' ? 250 : 150;
}

/** K·log10((T2 + T0)/(T1 + T0)): the right-hand side, (A/cmil)²·s. */
export function withstandConstant(material: Material, initialC: number, finalC: number): number {
  const c = ICEA_CONSTANTS[material === 'cu' ? 'cu' : 'al'];
  return c.k * Math.log10((finalC + c.t0C) / (initialC + c.t0C));
}

/** Longest time a conductor of `areaCmil` carries `currentA` without exceeding the final temperature, s. */
export function withstandTimeS(currentA: number, areaCmil: number, constant: number): number {
  const j = currentA / areaCmil;
  return constant / (j * j);
}

/** Smallest area that carries `currentA` for `timeS`, circular mils. */
export function withstandAreaCmil(currentA: number, timeS: number, constant: number): number {
  return currentA * Math.sqrt(timeS / constant);
}

/** Largest current a conductor of `areaCmil` carries for `timeS`, A. */
export function withstandCurrentA(areaCmil: number, timeS: number, constant: number): number {
  return areaCmil * Math.sqrt(constant / timeS);
}
