import { calculatedLoad } from './calculated-load';
import type { Rule } from './define';
import { conductorWithstand } from './conductor-withstand';
import { equipmentSccr } from './equipment-sccr';
import { interruptingRating } from './interrupting-rating';
import { voltageDropRule } from './voltage-drop';
import { generatorRule } from './generator';
import { panelboardProtection } from './panelboard-protection';
import { hvacCircuit } from './hvac-circuit';
import { hvacDevice } from './hvac-device';
import { motorCircuit } from './motor-circuit';
import { motorConductor } from './motor-conductor';
import { motorDevice } from './motor-device';
import { protectedNextSize } from './protected-next-size';
import { protectedRule } from './protected';
import { secondary10ft } from './secondary-10ft';
import { secondary25ft } from './secondary-25ft';
import { secondaryIndustrial25ft } from './secondary-industrial-25ft';
import { secondaryOutside } from './secondary-outside';
import { secondaryPrimaryProtected } from './secondary-primary-protected';
import { serviceRule } from './service';
import { tap10ft } from './tap-10ft';
import { tap25ft } from './tap-25ft';
import { tapFromTap } from './tap-from-tap';
import { tapHighBay } from './tap-high-bay';
import { tapOutside } from './tap-outside';
import { tapTransformer } from './tap-transformer';
import { transformerProtection } from './transformer-protection';

/** 240.4 first; a conductor it protects is not a tap conductor, so no tap rule is tried on it. */
export const PROTECTION_RULES: readonly Rule[] = [protectedRule, protectedNextSize];
/** 240.21(B) in code order: the first that holds names the verdict. */
export const FEEDER_TAP_RULES: readonly Rule[] = [tap10ft, tap25ft, tapTransformer, tapHighBay, tapOutside];
/** 240.21(C) in code order; (C)(5) sends a feeder-tapped transformer to 240.21(B)(3). */
export const SECONDARY_RULES: readonly Rule[] = [secondaryPrimaryProtected, secondary10ft, secondaryIndustrial25ft, secondaryOutside, secondary25ft];

/** Every rule, one line each, sorted by id. */
export const ALL_RULES: readonly Rule[] = [
  calculatedLoad,
  generatorRule,
  hvacCircuit,
  hvacDevice,
  motorCircuit,
  motorConductor,
  motorDevice,
  protectedRule,
  protectedNextSize,
  secondary10ft,
  secondary25ft,
  secondaryIndustrial25ft,
  secondaryOutside,
  secondaryPrimaryProtected,
  serviceRule,
  tap10ft,
  tap25ft,
  tapFromTap,
  tapHighBay,
  tapOutside,
  tapTransformer,
  transformerProtection,
];

/**
 * Equipment and study rules, sorted by id: they judge devices, equipment and
 * circuits from the short-circuit and voltage-drop studies (core/src/studies),
 * each over facts of its own, and add findings without deciding a verdict.
 */
export const STUDY_RULES = [conductorWithstand, equipmentSccr, interruptingRating, panelboardProtection, voltageDropRule] as const;

export const RULES_BY_ID: ReadonlyMap<string, Rule> = new Map(ALL_RULES.map((r) => [r.id, r]));

export { conductorWithstand, equipmentSccr, interruptingRating, panelboardProtection, voltageDropRule };
/** 240.4(G): circuits whose conductors their own article protects, tried instead of 240.4 on the branch circuit of one such load. */
export const OWN_ARTICLE_RULES = { motor: motorCircuit, hvac: hvacCircuit } as const;

export { calculatedLoad, generatorRule, serviceRule, tapFromTap, tapTransformer, transformerProtection };
export type { Rule } from './define';
export type { RunFacts, Termination, TransformerFacts } from './facts';
